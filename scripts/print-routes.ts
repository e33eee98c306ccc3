/** Prints the API route table (Markdown) from the routes the app really mounts, for the README. */
import { makeRouteList } from './route-list';

const rows = await makeRouteList();
console.log('| method | path | who | what |');
console.log('|---|---|---|---|');
for (const r of rows) console.log(`| ${r.method} | \`${r.path}\` | ${r.who} | ${r.summary} |`);

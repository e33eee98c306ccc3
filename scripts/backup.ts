/**
 * `npm run backup`: a consistent copy of the live database and the uploaded photos under
 * data/backups/<date-time>/ (BACKUP_DIR to put them elsewhere). Safe while Kindloop is running.
 */
import path from 'node:path';
import { loadConfig } from '../server/config/env';
import { takeBackup } from '../server/db/backup';

const config = loadConfig();
const backupsRoot = process.env.BACKUP_DIR ?? path.join(path.dirname(path.resolve(config.databasePath)), 'backups');

try {
  const { dir, manifest } = await takeBackup({ databasePath: config.databasePath, uploadDir: config.uploadDir, backupsRoot });
  const rows = Object.values(manifest.database.rows).reduce((s, n) => s + n, 0);
  console.log(`Backed up to ${dir}`);
  console.log(`  database: ${rows} rows in ${Object.keys(manifest.database.rows).length} tables, integrity ${manifest.database.integrity}`);
  console.log(`  uploads: ${manifest.uploads.files} files, ${(manifest.uploads.bytes / 1024 / 1024).toFixed(1)} MB`);
  if (manifest.uploads.missingPhotoFiles.length > 0) {
    console.log(`  ${manifest.uploads.missingPhotoFiles.length} photo files were removed while the backup ran; their rows are in the copy without them.`);
  }
  console.log(`Restore with: npm run restore -- ${dir}   (stop Kindloop first)`);
} catch (err) {
  console.error(`The backup failed: ${(err as Error).message}`);
  process.exit(1);
}

/**
 * `npm run restore -- <backup folder>`: puts a backup made by `npm run backup` in place of the
 * database (DATABASE_PATH) and the uploads (UPLOAD_DIR). Stop Kindloop before running it.
 */
import fs from 'node:fs';
import { loadConfig } from '../server/config/env';
import path from 'node:path';
import { restoreBackup, takeBackup } from '../server/db/backup';

const backupDir = process.argv[2];
if (!backupDir) {
  console.error('Name the backup folder: npm run restore -- data/backups/<date-time>');
  process.exit(1);
}
const config = loadConfig();
try {
  // What is there now is kept first, so a restore of the wrong backup can itself be undone.
  if (fs.existsSync(config.databasePath)) {
    const root = path.join(path.dirname(path.resolve(config.databasePath)), 'backups');
    const { dir } = await takeBackup({ databasePath: config.databasePath, uploadDir: config.uploadDir, backupsRoot: root });
    console.log(`Kept the current database and uploads in ${dir}, in case this was the wrong backup`);
  }
  const manifest = await restoreBackup({ backupDir, databasePath: config.databasePath, uploadDir: config.uploadDir });
  console.log(`Restored the backup of ${manifest.createdAt} to ${config.databasePath} and ${config.uploadDir}. Start Kindloop again.`);
} catch (err) {
  console.error(`The restore failed: ${(err as Error).message}`);
  process.exit(1);
}

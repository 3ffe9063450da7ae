/** Process wrapper for `npm run check -- [--text] [--equipment SETS.csv] FILE`; the logic is in check-command.ts. */
import { readFile } from 'node:fs/promises';
import { runCheckCommand } from './check-command';

process.exitCode = await runCheckCommand({
  args: process.argv.slice(2),
  readFile: (path) => readFile(path, 'utf8'),
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  today: new Date().toISOString().slice(0, 10),
});

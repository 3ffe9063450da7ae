/** Process wrapper for `npm run check -- [--text] [--equipment SETS.csv] FILE`; the logic is in check-command.ts. */
import { readFile } from 'node:fs/promises';
import { formatDate, runtimeTimeZone } from '@/lib/time-format';
import { runCheckCommand } from './check-command';

process.exitCode = await runCheckCommand({
  args: process.argv.slice(2),
  readFile: (path) => readFile(path, 'utf8'),
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  // The calendar day of the machine running the check (its zone); --today overrides it.
  today: formatDate(new Date(), runtimeTimeZone()),
});

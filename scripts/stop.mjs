// `npm run stop`: stops the services `npm start` left running for next time (its MariaDB and the
// local mail catcher), each by its pid file. The app server itself stops with Ctrl+C.
import { run, say, stopMailCatcher } from './lib.mjs';

const profile = process.argv[2] === 'test' ? 'test' : 'dev';
if (await stopMailCatcher(profile)) say(`stopped the ${profile} mail catcher`);
run('npx', ['tsx', 'db/cli.ts', 'stop', '--profile', profile]);

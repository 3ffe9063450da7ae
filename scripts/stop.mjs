// `npm run stop`: stops the services `npm start` left running for next time (its MariaDB, the local
// mail catcher and the local object store), each by its pid file. The app server itself stops with Ctrl+C.
import { run, say, stopMailCatcher, stopObjectStore } from './lib.mjs';

const profile = process.argv[2] === 'test' ? 'test' : 'dev';
if (await stopMailCatcher(profile)) say(`stopped the ${profile} mail catcher`);
if (await stopObjectStore(profile)) say(`stopped the ${profile} object store`);
run('npx', ['tsx', 'db/cli.ts', 'stop', '--profile', profile]);

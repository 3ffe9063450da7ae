// `npm start`: from a fresh machine to a running Bondmap. Installs what is missing (npm packages,
// Debian's mariadb-server), starts or reuses the project's own MariaDB, migrates, seeds the
// invented demo, builds when sources changed, serves, and prints the address and sign-ins.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuild, ensureDependencies, ROOT, run, say, startMailCatcher, startObjectStore, startServer } from './lib.mjs';

const port = Number(process.env.PORT ?? 4321);

try {
  ensureDependencies();
  // Without a real object store configured, photos go to the project's own local one (s3rver);
  // it starts first because the demo seeder stores its drawn photos there.
  const s3Env = process.env.BONDMAP_S3_ENDPOINT ? {} : await startObjectStore({ profile: 'dev', port: Number(process.env.BONDMAP_S3_PORT ?? 4568) });
  const envFile = join(ROOT, '.data', 'dev-app-env.json');
  run('npx', ['tsx', 'db/cli.ts', 'up', '--profile', 'dev', '--env-out', envFile], { env: s3Env });
  const dbEnv = JSON.parse(readFileSync(envFile, 'utf8'));
  // Without a real SMTP server configured, mail goes to the project's own local catcher.
  const smtpPort = Number(process.env.BONDMAP_SMTP_PORT ?? 2525);
  const mailEnv = process.env.BONDMAP_SMTP_URL
    ? {}
    : { BONDMAP_SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, BONDMAP_MAIL_CATCHER: '1' };
  if (!process.env.BONDMAP_SMTP_URL) await startMailCatcher({ profile: 'dev', port: smtpPort, env: dbEnv });
  ensureBuild();
  const { child, url } = await startServer({ port, env: { ...dbEnv, ...mailEnv, ...s3Env, BONDMAP_PUBLIC_URL: process.env.BONDMAP_PUBLIC_URL ?? `http://127.0.0.1:${port}` } });
  const demo = process.env.BONDMAP_DEMO === '0' ? '' : `
  Demo sign-ins (invented people; for the demo only — never use these on a real system),
  all with the password  bondmap-demo :
    admin@demo.test        admin
    reviewer@demo.test     reviewer   (also reviewer2@demo.test)
    lead@demo.test         crew lead
    apprentice@demo.test   apprentice
    lead@other.test        crew lead of a second organisation (shows isolation)
`;
  console.log(`
  Bondmap is running at ${url}
${demo}
  Mail: ${mailEnv.BONDMAP_MAIL_CATCHER ? `caught by the local mail server; admins read it at ${url}/admin/mail` : 'sent through BONDMAP_SMTP_URL'}
  Photos: ${s3Env.BONDMAP_S3_ENDPOINT ? `kept by the local object store at ${s3Env.BONDMAP_S3_ENDPOINT}` : 'stored through BONDMAP_S3_ENDPOINT'}
  Ctrl+C stops the app; MariaDB, the mail catcher and the object store keep running for next time (npm run stop stops them).
`);
  const stop = () => child.kill('SIGTERM');
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  child.on('exit', (code) => process.exit(code ?? 0));
} catch (error) {
  say(error instanceof Error ? error.message : String(error));
  process.exit(1);
}

/** Writes docs/permissions.md from the permissions table: `npm run docs:permissions`. */
import { writeFileSync } from 'node:fs';
import { permissionsMarkdown } from '../src/lib/domain/permissions';

const target = new URL('../docs/permissions.md', import.meta.url);
writeFileSync(target, permissionsMarkdown());
console.log(`wrote ${target.pathname}`);

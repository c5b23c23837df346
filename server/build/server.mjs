/* global console, process */
// Compiles the server for production: server/index.ts, the engine pool's worker, the database
// CLI, and each migration and seeder become plain JavaScript in dist-server/, so `npm start`
// runs node without a TypeScript loader. Packages stay in node_modules (not bundled).
import { readdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
// `node server/build/server.mjs [folder]`: dist-server/ unless another folder is named.
const outdir = path.resolve(process.argv[2] ?? path.join(root, 'dist-server'));
const scripts = (folder) =>
  readdirSync(path.join(root, folder))
    .filter((name) => name.endsWith('.ts') && !name.endsWith('.test.ts') && !name.endsWith('.d.ts'))
    .map((name) => ({
      in: path.join(root, folder, name),
      out: `${folder}/${name.replace(/\.ts$/, '')}`,
    }));

rmSync(outdir, { recursive: true, force: true });
const result = await build({
  absWorkingDir: root,
  entryPoints: [
    { in: 'server/index.ts', out: 'index' },
    { in: 'server/pool/worker-compiled.ts', out: 'pool-worker' },
    { in: 'server/db/cli.ts', out: 'db-cli' },
    { in: 'server/db/audit-verify.ts', out: 'audit-verify' },
    ...scripts('migrations'),
    ...scripts('seeders'),
  ],
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  packages: 'external',
  tsconfig: 'tsconfig.json',
  sourcemap: true,
  // Shared chunks sit beside index.js, so import.meta.url in them names this folder.
  chunkNames: '[name]-[hash]',
  logLevel: 'warning',
  // Sequelize names each model after its class, and queries name those aliases in SQL text
  // ("Route"."changed_at"); without this esbuild may rename a class (Route -> _Route).
  keepNames: true,
  metafile: true,
});
// What each output holds and imports: tests/unit/server/server-build.test.ts reads it to prove
// the server's own module graph holds no seeder.
writeFileSync(path.join(outdir, 'meta.json'), JSON.stringify(result.metafile));
console.log(`Server compiled into ${path.relative(process.cwd(), outdir) || '.'}/`);

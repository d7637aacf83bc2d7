// Compiles the server ahead of `npm start`: src/main.ts and what it imports, our workspace
// packages (@lotwise/*, TypeScript source) included, into ES modules in dist/ (dist/main.js
// and the chunks it imports when needed). npm packages stay outside the bundle and load from
// node_modules as usual (better-sqlite3 is native; the others gain nothing from being copied).
import { rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const serverDir = path.dirname(fileURLToPath(import.meta.url));
const outdir = path.join(serverDir, 'dist');

const requireFromServer = createRequire(path.join(serverDir, 'package.json'));

/** True when Node's require() can load the package (CommonJS, or a dual package's CJS build). */
function requirable(specifier) {
  try {
    requireFromServer.resolve(specifier);
    return true;
  } catch {
    return false;
  }
}

/**
 * Bare imports are npm packages, left to Node's resolution, except our own workspaces. Those
 * require() can load are loaded with require(): an ES module importing CommonJS makes Node scan
 * the package's files for export names first (for TypeORM, hundreds of files at every start).
 * ESM-only packages stay `import`s.
 */
const npmPackagesOutside = {
  name: 'npm-packages-outside',
  setup(build) {
    build.onResolve({ filter: /^[^./]/ }, (args) => {
      if (args.path.startsWith('@lotwise/') || args.namespace === 'required') return undefined;
      if (args.path.startsWith('node:') || !requirable(args.path)) {
        return { path: args.path, external: true };
      }
      return { path: args.path, namespace: 'required' };
    });
    build.onLoad({ filter: /.*/, namespace: 'required' }, (args) => ({
      contents: `module.exports = __requireOutside(${JSON.stringify(args.path)});`,
      loader: 'js',
    }));
  },
};

rmSync(outdir, { recursive: true, force: true });
await build({
  absWorkingDir: serverDir,
  // dist/ sits beside src/, one folder under apps/server, and every chunk is written straight
  // into it, so paths built from import.meta.url (the repository root, package.json) resolve
  // the same from both.
  entryPoints: { main: 'src/main.ts' },
  outdir,
  chunkNames: '[name]-[hash]',
  // Code behind a dynamic import() (the server itself, the payments fake) becomes its own chunk,
  // loaded only when that import runs.
  splitting: true,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  // The server's tsconfig.json: experimentalDecorators for the TypeORM entities and migrations.
  tsconfig: 'tsconfig.json',
  // TypeORM records migrations and finds entities by their class names.
  keepNames: true,
  sourcemap: true,
  logLevel: 'warning',
  banner: {
    js: "import { createRequire as __createRequire } from 'node:module';\nconst __requireOutside = __createRequire(import.meta.url);",
  },
  plugins: [npmPackagesOutside],
});

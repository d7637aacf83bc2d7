import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { repoRoot } from './settings';

/** One entry of Vite's build manifest (`build.manifest`). */
export interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
}
export type Manifest = Record<string, ManifestChunk>;

/** What a page loads before it shows: its chunks and their static imports, and their CSS. */
export interface PageWeight {
  jsGzipBytes: number;
  cssGzipBytes: number;
  files: string[];
}

/**
 * The files a page needs: the entry and the chunks whose source matches one of `pages`,
 * each with its static imports, followed recursively (dynamic imports load later, so they
 * are not counted unless a page pattern names them).
 */
export function pageFiles(manifest: Manifest, pages: RegExp[]): string[] {
  const keys = new Set<string>();
  const visit = (key: string) => {
    if (keys.has(key) || !manifest[key]) return;
    keys.add(key);
    for (const imported of manifest[key]!.imports ?? []) visit(imported);
  };
  for (const [key, chunk] of Object.entries(manifest)) {
    if (chunk.isEntry) visit(key);
  }
  for (const [key, chunk] of Object.entries(manifest)) {
    if (pages.some((page) => page.test(chunk.src ?? key))) visit(key);
  }
  const files = new Set<string>();
  for (const key of keys) {
    const chunk = manifest[key]!;
    files.add(chunk.file);
    for (const css of chunk.css ?? []) files.add(css);
  }
  return [...files].sort();
}

export function pageWeight(dist: string, files: string[]): PageWeight {
  let jsGzipBytes = 0;
  let cssGzipBytes = 0;
  for (const file of files) {
    const size = gzipSync(readFileSync(path.join(dist, file))).length;
    if (file.endsWith('.css')) cssGzipBytes += size;
    else if (file.endsWith('.js')) jsGzipBytes += size;
  }
  return { jsGzipBytes, cssGzipBytes, files };
}

/** The sign-in page and the chemicals list, as the production build serves them. */
export interface WebWeights {
  built: boolean;
  signIn: PageWeight;
  chemicalsList: PageWeight;
}

export const signInPages = [/features\/auth\/pages\/sign-in-page/];
/** A signed-in person opening the chemicals list: the app shell and the list page. */
export const chemicalsListPages = [
  /src\/app\/(layout|routes|router)/,
  /features\/chemicals\/pages\/chemicals-list-page/,
];

/** Builds the web app (unless told not to) and weighs its first pages from the manifest. */
export function webWeights(skipBuild: boolean): WebWeights {
  const dist = path.join(repoRoot, 'apps/web/dist');
  if (!skipBuild) {
    execFileSync('npm', ['run', 'build', '-w', 'apps/web'], { cwd: repoRoot, stdio: 'pipe' });
  }
  const manifestPath = path.join(dist, '.vite/manifest.json');
  if (!existsSync(manifestPath)) {
    throw new Error(
      `No Vite manifest at ${manifestPath}: build the web app with build.manifest on.`,
    );
  }
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Manifest;
  return {
    built: !skipBuild,
    signIn: pageWeight(dist, pageFiles(manifest, signInPages)),
    chemicalsList: pageWeight(dist, pageFiles(manifest, chemicalsListPages)),
  };
}

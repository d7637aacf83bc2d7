import { describe, expect, it } from 'vitest';
import { chemicalsListPages, pageFiles, signInPages, type Manifest } from './web-size';

const manifest: Manifest = {
  'index.html': {
    file: 'assets/index.js',
    isEntry: true,
    imports: ['_vendor.js'],
    dynamicImports: [
      'src/features/auth/pages/sign-in-page.tsx',
      'src/features/chemicals/pages/chemicals-list-page.tsx',
    ],
    css: ['assets/index.css'],
  },
  '_vendor.js': { file: 'assets/vendor.js' },
  '_table.js': { file: 'assets/table.js', css: ['assets/table.css'] },
  'src/features/auth/pages/sign-in-page.tsx': {
    file: 'assets/sign-in.js',
    src: 'src/features/auth/pages/sign-in-page.tsx',
    imports: ['_vendor.js'],
  },
  'src/features/chemicals/pages/chemicals-list-page.tsx': {
    file: 'assets/chemicals.js',
    src: 'src/features/chemicals/pages/chemicals-list-page.tsx',
    imports: ['_table.js'],
  },
};

describe('pageFiles', () => {
  it('when routes are lazy, then the sign-in page counts the entry, its own chunk and their static imports only', () => {
    expect(pageFiles(manifest, signInPages)).toEqual([
      'assets/index.css',
      'assets/index.js',
      'assets/sign-in.js',
      'assets/vendor.js',
    ]);
  });

  it('when the chemicals list is weighed, then its chunk and what it imports, with CSS, are added', () => {
    expect(pageFiles(manifest, chemicalsListPages)).toEqual([
      'assets/chemicals.js',
      'assets/index.css',
      'assets/index.js',
      'assets/table.css',
      'assets/table.js',
      'assets/vendor.js',
    ]);
  });
});

import { expect } from 'chai';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

/*
 * Unit conversion has one home, shared/hydraulics/units.ts (NIST SP 811 definitions, checked against mathjs): no
 * product file carries a literal conversion factor of its own. Comment text may quote a factor
 * when it cites a source, so only code is searched.
 */

const root = join(import.meta.dirname, '..', '..');
const productFolders = ['server', 'shared', 'data-import', 'src'];
const homeOfUnits = join('shared', 'hydraulics', 'units.ts');

/** inch, foot, US gallon (and gallons per m3), mechanical horsepower, in their usual spellings. */
const literalFactor =
  /(?<![\d.])(?:0?\.0254|25\.4|0?\.3048|304\.8|3\.785\d*|264\.17\d*|745\.7\d*|39\.37\d*|3\.2808\d*)(?![\d])/;

function productFiles(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = join(folder, name);
    if (statSync(path).isDirectory()) return productFiles(path);
    const isProductCode = name.endsWith('.ts') && !/\.(spec|test)\.ts$/.test(name) && name !== 'openapi-types.ts';
    return isProductCode ? [path] : [];
  });
}

/** The code of a file with block and line comments blanked, line numbers kept. */
function codeLines(text: string): string[] {
  return text
    .replace(/\/\*[\s\S]*?\*\//g, (comment) => comment.replace(/[^\n]/g, ' '))
    .split('\n')
    .map((line) => line.replace(/(^|[^:'"`])\/\/.*$/, '$1'));
}

/** `file:line: code` for every literal conversion factor in the code of `files`. */
function literalFactors(files: readonly string[]): string[] {
  return files.flatMap((file) =>
    codeLines(readFileSync(file, 'utf8')).flatMap((line, index) =>
      literalFactor.test(line) ? [`${relative(root, file)}:${index + 1}: ${line.trim()}`] : [],
    ),
  );
}

describe('unit conversion factors', () => {
  const files = productFolders.flatMap((folder) => productFiles(join(root, folder)));

  it('reads the product code of every side', () => {
    for (const folder of productFolders) {
      expect(files.some((file) => relative(root, file).startsWith(folder + '/'))).to.equal(true, folder);
    }
    expect(files.map((file) => relative(root, file))).to.include(homeOfUnits);
  });

  it('finds a factor in code and none in comments', () => {
    const probe = codeLines('const inch = 0.0254; // 25.4 mm\n/* 0.3048 m */ const foot = 12;');
    expect(probe.filter((line) => literalFactor.test(line))).to.deep.equal(['const inch = 0.0254; ']);
  });

  it('appear in the code of units.ts alone', () => {
    const elsewhere = files.filter((file) => relative(root, file) !== homeOfUnits);
    expect(literalFactors(elsewhere)).to.deep.equal([]);
  });
});

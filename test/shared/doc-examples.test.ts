import { expect } from 'chai';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import * as hydraulics from '../../shared/hydraulics';

/*
 * Runs the @example block of every doc comment in shared/hydraulics/. A block is TypeScript-like
 * lines using the engine's exports; a line `expression // => value` states a result, which must
 * agree with the computed one to the digits written (half a unit in the last digit given).
 */

const folder = join(import.meta.dirname, '..', '..', 'shared', 'hydraulics');

interface DocExample {
  file: string;
  lines: string[];
}

function docExamples(): DocExample[] {
  return readdirSync(folder)
    .filter((name) => name.endsWith('.ts'))
    .flatMap((file) => {
      const text = readFileSync(join(folder, file), 'utf8');
      const blocks = [...text.matchAll(/\/\*\*([\s\S]*?)\*\//g)].map((match) => match[1]);
      return blocks
        .filter((block) => block.includes('@example'))
        .map((block) => {
          const after = block.slice(block.indexOf('@example') + '@example'.length).split(/\n\s*\* @/)[0];
          const lines = after
            .split('\n')
            .map((line) => line.replace(/^\s*\*\s?/, ''))
            .filter((line) => line.trim() !== '');
          return { file, lines };
        });
    });
}

/** Half a unit in the last digit written: `1.234` -> 0.0005, `1.00160e-3` -> 5e-9. */
function toleranceOf(written: string): number {
  const [mantissa, exponent = '0'] = written.toLowerCase().split('e');
  const decimals = mantissa.includes('.') ? mantissa.split('.')[1].length : 0;
  return 0.5 * Math.pow(10, Number(exponent) - decimals);
}

/** Strips the type annotations the examples carry so the line runs as JavaScript. */
function asJavaScript(line: string): string {
  return line.replace(/\((\w+): number, (\w+): Float64Array\)/g, '($1, $2)');
}

function run(example: DocExample): Array<{ expression: string; actual: number; written: string }> {
  const names = Object.keys(hydraulics);
  const values = Object.values(hydraulics);
  const statements: string[] = [];
  const checks: string[] = [];
  example.lines.forEach((line) => {
    const [code, written] = line.split('// =>').map((part) => part.trim());
    if (written === undefined) statements.push(asJavaScript(code));
    else checks.push(`[${JSON.stringify(code)}, (${asJavaScript(code)}), ${JSON.stringify(written)}]`);
  });
  const body = `${statements.join('\n')}\nreturn [${checks.join(', ')}];`;
  const results = new Function(...names, body)(...values) as Array<[string, number, string]>;
  return results.map(([expression, actual, written]) => ({ expression, actual, written }));
}

describe('doc-comment examples of the engine', () => {
  const examples = docExamples();

  it('finds examples with stated results', () => {
    expect(examples.length).to.be.greaterThan(4);
    expect(examples.every((example) => example.lines.some((line) => line.includes('// =>')))).to.equal(true);
  });

  it('tells a wrong stated result from a right one', () => {
    const [right] = run({ file: 'probe', lines: ['waterDensity(20) // => 998.206'] });
    const [wrong] = run({ file: 'probe', lines: ['waterDensity(20) // => 998.306'] });
    expect(Math.abs(right.actual - Number(right.written))).to.be.at.most(toleranceOf(right.written));
    expect(Math.abs(wrong.actual - Number(wrong.written))).to.be.greaterThan(toleranceOf(wrong.written));
  });

  for (const example of examples) {
    it(`${example.file}: ${example.lines
      .find((line) => line.includes('// =>'))
      ?.split('// =>')[0]
      .trim()}`, () => {
      for (const { expression, actual, written } of run(example)) {
        expect(actual, expression).to.be.closeTo(Number(written), toleranceOf(written));
      }
    });
  }
});

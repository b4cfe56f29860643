import { expect } from 'chai';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import * as systemInputMapping from '../../shared/api/system-input';
import * as hydraulics from '../../shared/hydraulics';
import * as darcyFrictionTable from '../../shared/hydraulics/darcy-friction-table';
import * as leastSquares from '../../shared/hydraulics/least-squares';
import * as pumpCurvePoints from '../../shared/hydraulics/pump-curve-points';
import * as rootFinding from '../../shared/hydraulics/root-finding';

/*
 * Runs the @example block of every doc comment in shared/hydraulics/ and shared/api/system-input.ts.
 * A block is TypeScript-like lines using the engine's exports (and those of the engine's internal
 * modules); a line `expression // => value` states a result, which must agree with the computed
 * one to the digits written (half a unit in the last digit given); a result written as a quoted
 * string, true, false or null must be exactly that.
 */

const root = join(import.meta.dirname, '..', '..', 'shared');
const folder = join(root, 'hydraulics');

interface SourceFile {
  file: string;
  text: string;
}

const sources: SourceFile[] = [
  ...readdirSync(folder)
    .filter((name) => name.endsWith('.ts'))
    .map((file) => ({ file, text: readFileSync(join(folder, file), 'utf8') })),
  { file: 'api/system-input.ts', text: readFileSync(join(root, 'api', 'system-input.ts'), 'utf8') },
];

/** Everything an example may name: the engine's exports, its internal modules', the contract mapping's. */
const namespace: Record<string, unknown> = {
  ...darcyFrictionTable,
  ...leastSquares,
  ...pumpCurvePoints,
  ...rootFinding,
  ...systemInputMapping,
  ...hydraulics,
};

interface DocExample {
  file: string;
  lines: string[];
}

function docExamples(): DocExample[] {
  return sources.flatMap(({ file, text }) => {
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

/** The literal a written result stands for when it is not a number: a quoted string, true, false, null. */
function literalOf(written: string): { is: boolean; value?: string | boolean | null } {
  if (/^'.*'$/.test(written)) return { is: true, value: written.slice(1, -1) };
  if (written === 'true' || written === 'false') return { is: true, value: written === 'true' };
  if (written === 'null') return { is: true, value: null };
  return { is: false };
}

function run(example: DocExample): Array<{ expression: string; actual: unknown; written: string }> {
  const names = Object.keys(namespace);
  const values = Object.values(namespace);
  const statements: string[] = [];
  const checks: string[] = [];
  example.lines.forEach((line) => {
    const [code, written] = line.split('// =>').map((part) => part.trim());
    if (written === undefined) statements.push(asJavaScript(code));
    else checks.push(`[${JSON.stringify(code)}, (${asJavaScript(code)}), ${JSON.stringify(written)}]`);
  });
  const body = `${statements.join('\n')}\nreturn [${checks.join(', ')}];`;
  const results = new Function(...names, body)(...values) as Array<[string, unknown, string]>;
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
    expect(Math.abs(Number(right.actual) - Number(right.written))).to.be.at.most(toleranceOf(right.written));
    expect(Math.abs(Number(wrong.actual) - Number(wrong.written))).to.be.greaterThan(toleranceOf(wrong.written));
  });

  it('reads quoted strings, true, false and null as exact results', () => {
    expect(literalOf("'preferred'")).to.deep.equal({ is: true, value: 'preferred' });
    expect(literalOf('false')).to.deep.equal({ is: true, value: false });
    expect(literalOf('null')).to.deep.equal({ is: true, value: null });
    expect(literalOf('0.5').is).to.equal(false);
  });

  for (const example of examples) {
    it(`${example.file}: ${example.lines
      .find((line) => line.includes('// =>'))
      ?.split('// =>')[0]
      .trim()}`, () => {
      for (const { expression, actual, written } of run(example)) {
        const literal = literalOf(written);
        if (literal.is) expect(actual, expression).to.equal(literal.value);
        else expect(actual, expression).to.be.closeTo(Number(written), toleranceOf(written));
      }
    });
  }
});

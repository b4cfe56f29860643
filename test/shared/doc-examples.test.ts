import { expect } from 'chai';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import * as systemInputMapping from '../../shared/api/system-input';
import * as electrical from '../../shared/electrical';
import * as hydraulics from '../../shared/hydraulics';
import * as darcyFrictionTable from '../../shared/hydraulics/darcy-friction-table';
import * as leastSquares from '../../shared/hydraulics/least-squares';
import * as pumpCurvePoints from '../../shared/hydraulics/pump-curve-points';
import * as rootFinding from '../../shared/hydraulics/root-finding';

/*
 * Runs the @example block of every doc comment in shared/hydraulics/, shared/electrical/ and
 * shared/api/system-input.ts.
 * A block is TypeScript-like lines using the engine's exports (and those of the engine's internal
 * modules); a line `expression // => value` states a result, which must agree with the computed
 * one to the digits written (half a unit in the last digit given); a result written as a quoted
 * string, true, false or null must be exactly that. Then checks that every runtime function
 * exported by the engine (shared/hydraulics/index.ts), its internal modules and the contract
 * mapping is documented: @param for each parameter, @returns and an @example. No exceptions are
 * needed: the unit conversions, though bound from one factory, each carry their own block; a
 * class states no @returns (its constructor makes the instance).
 */

const root = join(import.meta.dirname, '..', '..', 'shared');
const folder = join(root, 'hydraulics');
const electricalFolder = join(root, 'electrical');

interface SourceFile {
  file: string;
  text: string;
}

const sources: SourceFile[] = [
  ...readdirSync(folder)
    .filter((name) => name.endsWith('.ts'))
    .map((file) => ({ file, text: readFileSync(join(folder, file), 'utf8') })),
  ...readdirSync(electricalFolder)
    .filter((name) => name.endsWith('.ts'))
    .map((file) => ({ file: `electrical/${file}`, text: readFileSync(join(electricalFolder, file), 'utf8') })),
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
  ...electrical,
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

/** What the runtime export is: a function or a class, whose source text names its parameters. */
type RuntimeFunction = (...args: never[]) => unknown;

/** The parameter names of a function or of a class's constructor, read from its source text. */
function parameterNames(value: RuntimeFunction): string[] {
  const text = Function.prototype.toString.call(value);
  const start = text.startsWith('class') ? text.indexOf('(', text.indexOf('constructor')) : text.indexOf('(');
  if (text.startsWith('class') && !text.includes('constructor')) return [];
  let depth = 0;
  let current = '';
  const parts: string[] = [];
  for (const character of text.slice(start + 1)) {
    if (character === '(' || character === '[' || character === '{') depth += 1;
    if (character === ')' || character === ']' || character === '}') {
      if (depth === 0) break;
      depth -= 1;
    }
    if (character === ',' && depth === 0) {
      parts.push(current);
      current = '';
    } else current += character;
  }
  parts.push(current);
  return parts.map((part) => part.split('=')[0].trim()).filter((name) => name !== '');
}

/**
 * The doc comment of an exported name: the `/** ... *\/` block right above its declaration; for a
 * class, with the class body up to its constructor (where the constructor's own block sits).
 */
function docOf(name: string): string | null {
  for (const { text } of sources) {
    const declaration = new RegExp(`/\\*\\*((?:[^*]|\\*(?!/))*)\\*/\\s*export (?:function|const|class) ${name}\\b`);
    const match = declaration.exec(text);
    if (!match) continue;
    if (!text.slice(match.index).includes(`export class ${name}`)) return match[1];
    const classStart = match.index + match[0].length;
    return match[1] + text.slice(classStart, text.indexOf('constructor(', classStart));
  }
  return null;
}

/** What a runtime export's documentation lacks; empty when it is complete. */
function missingDocumentation(name: string, value: RuntimeFunction): string[] {
  const doc = docOf(name);
  if (doc === null) return ['a doc comment'];
  const isClass = Function.prototype.toString.call(value).startsWith('class');
  const missing = parameterNames(value)
    .filter((parameter) => !new RegExp(`@param ${parameter}\\b`).test(doc))
    .map((parameter) => `@param ${parameter}`);
  // A constructor's result is the instance its class describes, so a class states no @returns.
  if (!isClass && !doc.includes('@returns')) missing.push('@returns');
  if (!doc.includes('@example')) missing.push('@example');
  return missing;
}

describe('doc comments of the engine are complete', () => {
  // the engine's exports, its internal modules' and the contract mapping's
  const functions = (Object.entries(namespace) as Array<[string, unknown]>).filter(
    (entry): entry is [string, RuntimeFunction] => typeof entry[1] === 'function',
  );

  it('reads parameter names from functions, arrows and constructors', () => {
    expect(parameterNames(hydraulics.headLossDarcyWeisbach)).to.deep.equal([
      'length',
      'flow',
      'insideDiameter',
      'roughness',
      'kinematicViscosity',
      'method',
      'field',
    ]);
    expect(parameterNames(hydraulics.flowToSI)).to.deep.equal(['value', 'unitName', 'field']);
    expect(parameterNames(hydraulics.CubicHermiteTable as unknown as RuntimeFunction)).to.deep.equal([
      'low',
      'high',
      'intervals',
      'sample',
    ]);
  });

  it('names what an undocumented function lacks', () => {
    const bare = Object.assign(() => 0, {});
    expect(missingDocumentation('notExportedAnywhere', bare)).to.deep.equal(['a doc comment']);
  });

  it('gives every exported function @param for each parameter, @returns and @example', () => {
    expect(functions.length).to.be.greaterThan(80);
    const incomplete = functions
      .map(([name, value]) => ({ name, missing: missingDocumentation(name, value) }))
      .filter(({ missing }) => missing.length > 0)
      .map(({ name, missing }) => `${name}: ${missing.join(', ')}`);
    expect(incomplete, `incomplete doc comments:\n${incomplete.join('\n')}`).to.deep.equal([]);
  });
});

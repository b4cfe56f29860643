import { expect } from 'chai';
import { compileSystemCurve, systemBreakdown } from '../../shared/hydraulics';
import { engineIssueText, type IssueValueText } from '../../shared/messages/engine-issue-text';

describe('engine issue text', () => {
  const coldHazenWilliams = compileSystemCurve({
    staticHead: 1,
    temperature: 2,
    frictionMethod: 'hazen-williams',
    segments: [{ length: 10, insideDiameter: 0.02, hazenWilliamsC: 150 }],
  });

  it('gives the engine issues as codes with SI numbers and the input they concern', () => {
    const issues = systemBreakdown(coldHazenWilliams, 0.001).issues;
    expect(issues.map((issue) => issue.code)).to.deep.equal([
      'hazen-williams-temperature',
      'segment-velocity',
      'hazen-williams-out-of-range',
    ]);
    expect(issues[0]).to.deep.equal({
      code: 'hazen-williams-temperature',
      params: { temperature: 2 },
      pointer: '/temperature',
    });
    // 0.001 m3/s through a 20 mm bore: V = Q / (pi D^2 / 4) = 3.183 m/s
    const velocity = issues[1].code === 'segment-velocity' ? issues[1].params.velocity : Number.NaN;
    expect(velocity).to.be.closeTo(3.183, 0.001);
  });

  it('writes each sentence from the one table, in the units the reader asks for', () => {
    const [temperature, velocity] = systemBreakdown(coldHazenWilliams, 0.001).issues;
    expect(engineIssueText(temperature)).to.equal(
      'Hazen-Williams is fitted to water at about 4-25 C; at 2 C prefer Darcy-Weisbach',
    );
    expect(engineIssueText(velocity)).to.equal(
      'at 0.001 m3/s segment 0: velocity 3.18 m/s exceeds 1.52 m/s, the common-practice limit for plastic pipe',
    );
    const litresPerSecond: IssueValueText = {
      flow: (flow) => `${flow * 1000} L/s`,
      velocity: (speed) => `${speed.toFixed(1)} m/s`,
      head: (head) => `${head} m`,
      power: (power) => `${power / 1000} kW`,
    };
    expect(engineIssueText(velocity, litresPerSecond)).to.match(
      /^at 1 L\/s segment 0: velocity 3\.2 m\/s exceeds 1\.5 m\/s/,
    );
  });
});

import { expect } from 'chai';
import type { DesignDraft, SelectionCandidate } from '../../../shared/api/api-schemas';
import { partsList, partsListCsv, sticksFor, type PartsLine } from '../../../server/reports/parts-list';

/*
 * The crew's parts list on hand-worked cases. Sticks are whole: the bought length (measured plus
 * the allowance) over the stick length, rounded up; feet to metres by 0.3048 m/ft exactly (NIST
 * SP 811, appendix B.8).
 */

function design(unitSystem: 'us' | 'si', segments: DesignDraft['system']['segments']): DesignDraft {
  return {
    unitSystem,
    system: {
      staticMode: 'direct',
      staticHead: 4,
      intakeLevel: 0,
      dischargeLevel: 4,
      outletPressureHead: 0,
      waterTemperatureC: 20,
      frictionMethod: 'hazen-williams',
      segments,
    },
    band: { flowMin: 90, flowMax: 130 },
    search: {
      arrangements: [1, 2],
      requireOneFailed: false,
      standby: true,
      onlyPreferredRegion: false,
      maxInputPowerPerPump: null,
      hoursPerDay: 24,
      tariffPerKWh: null,
      limit: 20,
    },
  };
}

const pipe = (lines: PartsLine[]) => lines.filter((line) => line.section === 'pipe');

describe("reports: the crew's parts list", () => {
  it('counts 10 ft, 20 ft and 6 m sticks for 240 ft of pipe and 10 % allowance', () => {
    // 240 x 1.10 = 264 ft; 264 / 10 = 26.4 -> 27; 264 / 20 = 13.2 -> 14; 264 x 0.3048 = 80.4672 m, / 6 = 13.41 -> 14
    const [line] = pipe(
      partsList(
        design('us', [{ series: 'pvc-sch40', size: 'pvc-sch40-3', length: 240, fittings: [], extraK: 0 }]),
        null,
      ),
    );
    expect(line).to.include({
      item: 'PVC Schedule 40',
      quantity: 264,
      unit: 'ft',
      sticks10ft: 27,
      sticks20ft: 14,
      sticks6m: 14,
    });
  });

  it('buys exactly the sticks a whole length needs, no extra one for rounding', () => {
    // 200 ft, no allowance: 20 of 10 ft, 10 of 20 ft; 60.96 m / 6 = 10.16 -> 11
    const [us] = pipe(
      partsList(
        design('us', [{ series: 'pvc-sch40', size: 'pvc-sch40-2', length: 200, fittings: [], extraK: 0 }]),
        null,
        0,
      ),
    );
    expect(us).to.include({ quantity: 200, sticks10ft: 20, sticks20ft: 10, sticks6m: 11 });
    // 30 m + 24 m of one size add up to 54 m: 9 of 6 m exactly; 177.17 ft -> 18 of 10 ft, 9 of 20 ft (8.86)
    const [si] = pipe(
      partsList(
        design('si', [
          { series: 'pvc-sch40', size: 'pvc-sch40-2', length: 30, fittings: [], extraK: 0 },
          { series: 'pvc-sch40', size: 'pvc-sch40-2', length: 24, fittings: [], extraK: 0 },
        ]),
        null,
        0,
      ),
    );
    expect(si).to.include({ quantity: 54, unit: 'm', sticks6m: 9, sticks10ft: 18, sticks20ft: 9 });
    // 0.1 + 0.2 is 0.30000000000000004 in binary: still one stick of 0.3
    expect(sticksFor(0.1 + 0.2, 0.3)).to.equal(1);
    expect(sticksFor(60.000001, 6)).to.equal(11);
  });

  it('keeps sizes apart, counts fittings by kind and size, valves on their own, and leaves out entrances and exits', () => {
    const lines = partsList(
      design('us', [
        {
          series: 'pvc-sch40',
          size: 'pvc-sch40-3',
          length: 100,
          fittings: [
            { kind: 'entrance-sharp', count: 1 },
            { kind: 'elbow-90-standard', count: 2 },
            { kind: 'check-valve-swing', count: 1 },
          ],
          extraK: 0,
        },
        {
          series: 'pvc-sch40',
          size: 'pvc-sch40-2',
          length: 50,
          fittings: [
            { kind: 'elbow-90-standard', count: 3 },
            { kind: 'valve-ball', count: 0 },
            { kind: 'exit', count: 1 },
          ],
          extraK: 2.5,
        },
        {
          series: 'pvc-sch40',
          size: 'pvc-sch40-3',
          length: 20,
          fittings: [{ kind: 'elbow-90-standard', count: 1 }],
          extraK: 0,
        },
      ]),
      null,
    );
    // 120 ft of 3" (x 1.1 = 132: 14, 7, 132 x 0.3048 / 6 = 6.7 -> 7) and 50 ft of 2" (55: 6, 3, 2.79 -> 3)
    expect(
      pipe(lines).map((line) => [line.size, line.quantity, line.sticks10ft, line.sticks20ft, line.sticks6m]),
    ).to.deep.equal([
      ['3"', 132, 14, 7, 7],
      ['2"', 55, 6, 3, 3],
    ]);
    expect(
      lines.filter((line) => line.section === 'fitting').map((line) => [line.item, line.size, line.quantity]),
    ).to.deep.equal([
      ['90-degree standard elbow', '3"', 3],
      ['90-degree standard elbow', '2"', 3],
    ]);
    expect(lines.filter((line) => line.section === 'valve').map((line) => [line.size, line.quantity])).to.deep.equal([
      ['3"', 1],
    ]);
    expect(lines.some((line) => /entrance|exit/i.test(line.item))).to.equal(false);
    expect(lines.filter((line) => line.section === 'equipment')).to.have.length(1);
  });

  it('lists the pumps of the chosen candidate, duty and standby', () => {
    const chosen = {
      supplier: 'Invented Pumps',
      model: 'Cascade 40',
      modelCode: 'IP-40',
      arrangement: { installed: 3, running: 2 },
    } as SelectionCandidate;
    const pumps = partsList(
      design('us', [{ series: 'pvc-sch40', size: 'pvc-sch40-3', length: 10, fittings: [], extraK: 0 }]),
      chosen,
    ).filter((line) => line.section === 'pump');
    expect(pumps.map((line) => [line.item, line.size, line.quantity, line.notes])).to.deep.equal([
      ['Invented Pumps Cascade 40', 'IP-40', 2, 'duty'],
      ['Invented Pumps Cascade 40', 'IP-40', 1, 'standby'],
    ]);
  });

  it('totals pipe and fittings over the common run and every branch, and lists named equipment where it stands', () => {
    // common run 30 ft + falls 40 ft of 3 in = 70 ft, x 1.10 = 77 ft; filter return 150 ft of 2 in x 1.10 = 165 ft
    const branched = design('us', [
      {
        series: 'pvc-sch40',
        size: 'pvc-sch40-3',
        length: 30,
        fittings: [{ kind: 'elbow-90-standard', count: 2 }],
        extraK: 0,
      },
    ]);
    const segment = (
      size: string,
      length: number,
      equipment: DesignDraft['system']['segments'][number]['equipment'],
    ) => ({
      series: 'pvc-sch40',
      size,
      length,
      fittings: [{ kind: 'elbow-90-standard' as const, count: 1 }],
      extraK: 0,
      equipment,
    });
    branched.system.branches = [
      {
        name: 'Falls',
        staticMode: 'direct',
        staticHead: 6,
        outletLevel: 0,
        outletPressureHead: 0,
        segments: [segment('pvc-sch40-3', 40, [])],
      },
      {
        name: 'Filter return',
        staticMode: 'direct',
        staticHead: 1.5,
        outletLevel: 0,
        outletPressureHead: 0,
        segments: [segment('pvc-sch40-2', 150, [{ name: 'Bead filter', headLoss: 4, atFlow: 60 }])],
      },
    ];
    const lines = partsList(branched, null);
    expect(pipe(lines).map((line) => [line.size, line.quantity])).to.deep.equal([
      ['3"', 77],
      ['2"', 165],
    ]);
    const elbows = lines.filter((line) => line.section === 'fitting').map((line) => [line.size, line.quantity]);
    expect(elbows).to.deep.equal([
      ['3"', 3],
      ['2"', 1],
    ]);
    const equipment = lines.filter((line) => line.section === 'equipment');
    expect(equipment.map((line) => [line.item, line.size, line.notes])).to.deep.equal([
      ['Bead filter', '2"', 'Filter return, segment 1, rated 4 ft at 60 gpm'],
    ]);
  });

  describe('the cable to each pump', () => {
    const chosen = {
      supplier: 'Invented Pumps',
      model: 'Cascade 40',
      modelCode: 'IP-40',
      arrangement: { installed: 3, running: 2 },
    } as SelectionCandidate;
    const withCable = (unitSystem: 'us' | 'si', cableLength: number | undefined) => ({
      ...design(unitSystem, [{ series: 'pvc-sch40', size: 'pvc-sch40-3', length: 10, fittings: [], extraK: 0 }]),
      ...(cableLength === undefined ? {} : { cableLength }),
    });
    const cable = (lines: PartsLine[]) => lines.filter((line) => line.section === 'electrical');
    const rating = { fullLoadCurrent: 7.5, voltage: 120, phases: 1 };

    it('sizes one circuit per pump, duty and standby, for the drop: 250 ft at 7.5 A and 120 V needs 8 AWG', () => {
      // by hand, single phase 2 L I R at 75 C (NEC Chapter 9 Table 8, from memory): 10 AWG 2 x 250 x 7.5 x 1.26e-3 = 4.7 V
      // = 3.9 % misses 3 %; 8 AWG 0.778e-3 gives 2.9 V = 2.4 %. Metric, 76.2 m: 6 mm2 (3.08 ohm/km at 20 C x 1.216 at 75 C)
      // drops 4.3 V = 3.6 %, 10 mm2 (1.83 x 1.216) 2.5 V = 2.1 %. Bought: 250 ft x 3 pumps x 1.10 = 825 ft.
      const [line] = cable(partsList(withCable('us', 250), chosen, 10, rating));
      expect(line).to.include({ item: 'Copper pump cable', size: '8 AWG (or 10 mm2)', quantity: 825, unit: 'ft' });
      expect(line.notes).to.match(
        /^3 circuits of 250 ft one way \+ 10 % allowance; smallest under 3 % drop at 7\.5 A, 120 V, 1 phase; a licensed electrician/,
      );
      const [metric] = cable(partsList(withCable('si', 76.2), chosen, 0, rating));
      expect(metric).to.include({ size: '10 mm2 (or 8 AWG)', quantity: 228.6, unit: 'm' });
    });

    it('says "to be sized" without a rating in the catalog, and lists no cable without a cable run', () => {
      const [line] = cable(
        partsList(withCable('us', 60), chosen, 10, { fullLoadCurrent: null, voltage: 230, phases: 1 }),
      );
      expect(line.size).to.equal('to be sized');
      expect(line.notes).to.contain('the catalog gives no full-load current, voltage and phases');
      expect(cable(partsList(withCable('us', undefined), chosen, 10, rating))).to.deep.equal([]);
      expect(cable(partsList(withCable('us', 60), null, 10, rating))).to.deep.equal([]);
    });
  });

  it('writes CSV whose text cells a spreadsheet would run as formulas start with an apostrophe', () => {
    const csv = partsListCsv([
      {
        section: 'pump',
        item: '=HYPERLINK("http://example.test")',
        size: '+1',
        quantity: 1,
        unit: 'each',
        sticks10ft: null,
        sticks20ft: null,
        sticks6m: null,
        notes: '@sum',
      },
    ]);
    expect(csv.split('\n')[1]).to.equal(`pump,"'=HYPERLINK(""http://example.test"")",'+1,1,each,,,,'@sum`);
  });
});

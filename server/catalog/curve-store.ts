import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { ExistingPump, ImportPhase, PlannedPump } from '../../data-import/curve-import-plan';
import type { ReadPumpDetails } from '../../data-import/curve-table-reader';
import { Pump } from '../database/models';
import { fixedSpeedsOf, fixedSpeedsText } from '../database/models/pump';

/*
 * The curve store: what a supplier holds, and the writes of one import. The revisions and points
 * go in as raw bulk inserts, the hot path of an import that `npm run bench:import` times against
 * a bare bulk insert of the same rows; pump details go through the model.
 */

const pointRowsPerInsert = 4000;

export async function loadExistingPumps(
  sequelize: Sequelize,
  supplierId: number,
  transaction?: Transaction,
): Promise<Map<string, ExistingPump>> {
  const rows = await sequelize.query<{
    id: number;
    model_code: string;
    display_name: string;
    kind: ReadPumpDetails['kind'];
    nominal_speed_rpm: number | null;
    voltage_v: number | null;
    phase_count: number | null;
    full_load_current_a: number | null;
    speed_min_rpm: number | null;
    speed_max_rpm: number | null;
    fixed_speeds_rpm: string | null;
    discharge_size_mm: number | null;
    solids_handling_mm: number | null;
    list_price: string | null;
    price_currency: string | null;
    motor_efficiency: number | null;
    status: ReadPumpDetails['status'];
    content_hash: string | null;
    current_number: number | null;
    highest_number: number | null;
  }>(
    `SELECT p.id, p.model_code, p.display_name, p.kind, p.nominal_speed_rpm, p.voltage_v, p.phase_count, p.full_load_current_a,
            p.speed_min_rpm, p.speed_max_rpm, p.fixed_speeds_rpm, p.discharge_size_mm,
            p.solids_handling_mm, p.list_price, p.price_currency, p.motor_efficiency, p.status, r.content_hash, r.number AS current_number,
            (SELECT MAX(x.number) FROM curve_revisions x WHERE x.pump_id = p.id) AS highest_number
       FROM pumps p LEFT JOIN curve_revisions r ON r.id = p.current_revision_id
      WHERE p.supplier_id = ?`,
    { replacements: [supplierId], type: QueryTypes.SELECT, transaction },
  );
  return new Map(
    rows.map((row) => [
      row.model_code,
      {
        id: row.id,
        contentHash: row.content_hash,
        currentNumber: row.current_number,
        highestNumber: Number(row.highest_number ?? 0),
        details: {
          displayName: row.display_name,
          kind: row.kind,
          nominalSpeedRpm: row.nominal_speed_rpm,
          voltageV: row.voltage_v,
          phaseCount: row.phase_count,
          fullLoadCurrentA: row.full_load_current_a,
          speedMinRpm: row.speed_min_rpm,
          speedMaxRpm: row.speed_max_rpm,
          fixedSpeedsRpm: fixedSpeedsOf(row.fixed_speeds_rpm),
          dischargeSizeMm: row.discharge_size_mm,
          solidsHandlingMm: row.solids_handling_mm,
          listPrice: row.list_price === null ? null : Number(row.list_price),
          priceCurrency: row.price_currency,
          motorEfficiency: row.motor_efficiency,
          status: row.status,
          notes: null,
        },
      },
    ]),
  );
}

export interface WriteOptions {
  supplierId: number;
  importId: number;
  plan: PlannedPump[];
  fileName: string;
  fileChecksum: string;
  fileUnits: object;
  transaction: Transaction;
  onProgress?: (phase: ImportPhase, done: number, total: number) => void;
}

/** The writes of one import, all inside the caller's transaction. */
export async function writePumps(sequelize: Sequelize, options: WriteOptions): Promise<void> {
  const { supplierId, importId, plan, transaction, onProgress } = options;
  const queryInterface = sequelize.getQueryInterface();
  const totalSteps = plan.length * 2;
  const now = new Date();

  const detailRows = plan.filter((pump) => pump.changes.includes('details'));
  if (detailRows.length > 0) {
    await Pump.bulkCreate(
      detailRows.map(({ read }) => {
        const { notes: _notes, fixedSpeedsRpm, ...details } = read.details;
        return {
          supplierId,
          modelCode: read.modelCode,
          ...details,
          fixedSpeedsRpm: fixedSpeedsText(fixedSpeedsRpm),
          listPrice: details.listPrice === null ? null : details.listPrice.toFixed(2),
          currentRevisionId: null,
        };
      }),
      {
        transaction,
        updateOnDuplicate: [
          'displayName',
          'kind',
          'nominalSpeedRpm',
          'voltageV',
          'phaseCount',
          'fullLoadCurrentA',
          'speedMinRpm',
          'speedMaxRpm',
          'fixedSpeedsRpm',
          'dischargeSizeMm',
          'solidsHandlingMm',
          'listPrice',
          'priceCurrency',
          'motorEfficiency',
          'status',
          'updatedAt',
        ],
      },
    );
  }
  onProgress?.('writing', plan.length, totalSteps);

  const curveRows = plan.filter((pump) => pump.changes.includes('curve'));
  if (curveRows.length === 0) return;
  const pumpIds = new Map(
    (
      await sequelize.query<{ id: number; model_code: string }>(
        'SELECT id, model_code FROM pumps WHERE supplier_id = ?',
        {
          replacements: [supplierId],
          type: QueryTypes.SELECT,
          transaction,
        },
      )
    ).map((row) => [row.model_code, row.id]),
  );
  await queryInterface.bulkInsert(
    'curve_revisions',
    curveRows.map(({ read, checked, contentHash, revisionNumber }) => {
      const fit = checked.fit!;
      const heads = read.points.map((point) => point.head);
      return {
        pump_id: pumpIds.get(read.modelCode),
        number: revisionNumber,
        import_id: importId,
        source_file_name: options.fileName.slice(0, 255),
        source_checksum: options.fileChecksum,
        content_hash: contentHash,
        file_units: JSON.stringify(options.fileUnits),
        notes: read.details.notes,
        point_count: read.points.length,
        flow_min_m3s: fit.flowMin,
        flow_max_m3s: fit.flowMax,
        head_min_m: Math.min(...heads),
        head_max_m: Math.max(...heads),
        bep_flow_m3s: fit.bep?.flow ?? null,
        bep_head_m: fit.bep?.head ?? null,
        bep_efficiency: fit.bep?.efficiency ?? null,
        fit: JSON.stringify(fit),
        created_at: now,
      };
    }),
    { transaction },
  );
  const revisionIds = new Map(
    (
      await sequelize.query<{ id: number; pump_id: number }>(
        'SELECT id, pump_id FROM curve_revisions WHERE import_id = ?',
        {
          replacements: [importId],
          type: QueryTypes.SELECT,
          transaction,
        },
      )
    ).map((row) => [row.pump_id, row.id]),
  );

  const pointRows: object[] = [];
  const rangeRows: object[] = [];
  let written = plan.length;
  const flushPoints = async () => {
    if (pointRows.length === 0) return;
    await queryInterface.bulkInsert('curve_points', pointRows.splice(0), { transaction });
  };
  for (const { read } of curveRows) {
    const revisionId = revisionIds.get(pumpIds.get(read.modelCode)!);
    read.points.forEach((point, position) => {
      pointRows.push({
        revision_id: revisionId,
        position,
        flow_m3s: point.flow,
        head_m: point.head,
        power_w: point.power ?? null,
        efficiency: point.efficiency ?? null,
        npsh_required_m: point.npshRequired ?? null,
      });
    });
    for (const [region, range] of [
      ['preferred', read.preferred],
      ['allowable', read.allowable],
    ] as const) {
      if (range)
        rangeRows.push({ revision_id: revisionId, region, flow_min_m3s: range.flowMin, flow_max_m3s: range.flowMax });
    }
    written += 1;
    if (pointRows.length >= pointRowsPerInsert) {
      await flushPoints();
      onProgress?.('writing', written, totalSteps);
    }
  }
  await flushPoints();
  if (rangeRows.length > 0) await queryInterface.bulkInsert('curve_declared_ranges', rangeRows, { transaction });
  await sequelize.query(
    `UPDATE pumps p JOIN curve_revisions r ON r.pump_id = p.id
        SET p.current_revision_id = r.id, p.updated_at = ?
      WHERE r.import_id = ?`,
    { replacements: [now, importId], transaction },
  );
  onProgress?.('writing', totalSteps, totalSteps);
}

import type { Readable } from 'node:stream';
import type { Sequelize } from 'sequelize';
import type { CurveImportReport } from '../../shared/api/api-schemas';
import {
  checkCurveTable,
  importReport,
  planPumps,
  storedReport,
  type ImportPhase,
} from '../../data-import/curve-import-plan';
import { issue } from '../../data-import/curve-table-cells';
import { readCurveTable, type ReadCurveTable } from '../../data-import/curve-table-reader';
import { acceptedEncodings, CurveTableDecoder, type UndecodableBytes } from '../../data-import/curve-table-stream';
import { CurveImport, type Supplier } from '../database/models';
import { claimCurveImport, type CurveImportClaim, type ImportActor } from './curve-import-claim';
import { loadExistingPumps, writePumps } from './curve-store';

/*
 * The one import path, used by the command, the API and the demo seed: read and check the file
 * (data-import), compare with what the supplier already has and, unless a dry run, write every
 * pump of the file in one transaction, or none. One import per supplier runs at a time, across
 * processes (curve-import-claim.ts).
 */

export interface CurveImportOptions {
  sequelize: Sequelize;
  supplier: Supplier;
  source: Readable;
  fileName: string;
  dryRun: boolean;
  actor: ImportActor;
  /** The file's size when known, so that progress can be shown as a fraction. */
  totalBytes?: number;
  onProgress?: (phase: ImportPhase, done: number, total: number) => void;
  maxFileBytes?: number;
  maxPointRows?: number;
  /** The supplier already held by the caller (the API holds it while the upload arrives); else held here. */
  claim?: CurveImportClaim;
}

/** A file that stopped being text: only that is reported, what was read before it is moot. */
function undecodable(read: ReadCurveTable, problem: UndecodableBytes): ReadCurveTable {
  return {
    ...read,
    pumps: [],
    errors: [
      issue(problem.line, null, 'not-text', {
        reason: problem.reason,
        byte: problem.byte,
        accepted: acceptedEncodings,
      }),
    ],
    errorsOmitted: 0,
    warnings: [],
  };
}

/**
 * Checks a curve-table file and, unless `dryRun`, writes it. The report lists errors by row and
 * column; when there is any error nothing is written. Throws CurveImportRunningError while
 * another import of the supplier runs, and otherwise only for failures of the system (the
 * database), never for what the file holds.
 */
export async function importCurveTable(options: CurveImportOptions): Promise<CurveImportReport> {
  if (options.claim) {
    if (options.claim.supplierId !== options.supplier.id) throw new Error('the claim is for another supplier');
    return importClaimed(options);
  }
  const claim = await claimCurveImport(options.sequelize, options.supplier, options.actor);
  try {
    return await importClaimed(options);
  } finally {
    await claim.release();
  }
}

async function importClaimed(options: CurveImportOptions): Promise<CurveImportReport> {
  const { sequelize, supplier, actor, onProgress } = options;
  const decoder = new CurveTableDecoder();
  options.source.once('error', (error) => decoder.destroy(error));
  const decoded = await readCurveTable(options.source.pipe(decoder), {
    maxFileBytes: options.maxFileBytes,
    maxPointRows: options.maxPointRows,
    onBytes: (bytes) => onProgress?.('reading', bytes, options.totalBytes ?? bytes),
  });
  if (decoder.problem) options.source.destroy();
  const read = decoder.problem ? undecodable(decoded, decoder.problem) : decoded;
  const checked = checkCurveTable(read, (done, total) => onProgress?.('checking', done, total));
  const context = (committed: boolean, importId: number | null) => ({
    supplier: { id: supplier.id, code: supplier.code, name: supplier.name },
    fileName: options.fileName,
    dryRun: options.dryRun,
    committed,
    importId,
  });

  if (checked.hasErrors || options.dryRun) {
    const existing = await loadExistingPumps(sequelize, supplier.id);
    return importReport(checked, planPumps(checked.pumps, existing, checked.powerBasis), context(false, null));
  }

  return sequelize.transaction(async (transaction) => {
    // One import per supplier at a time: the plan below is made under this lock.
    await sequelize.query('SELECT id FROM suppliers WHERE id = ? FOR UPDATE', {
      replacements: [supplier.id],
      transaction,
    });
    const existing = await loadExistingPumps(sequelize, supplier.id, transaction);
    const plan = planPumps(checked.pumps, existing, checked.powerBasis);
    const toWrite = plan.filter((pump) => pump.outcome === 'new' || pump.outcome === 'changed');
    if (toWrite.length === 0) return importReport(checked, plan, context(false, null));

    const draft = importReport(checked, plan, context(true, null));
    const record = await CurveImport.create(
      {
        supplierId: supplier.id,
        importedByUserId: actor.userId,
        importedBy: actor.label.slice(0, 200),
        channel: actor.channel,
        fileName: options.fileName.slice(0, 255),
        fileChecksum: read.fileChecksum,
        fileUnits: read.fileUnits ?? {},
        rowCount: read.pointRowCount,
        pumpCount: read.pumps.length,
        newCount: draft.counts.new,
        changedCount: draft.counts.changed,
        unchangedCount: draft.counts.unchanged,
        report: storedReport(draft),
      },
      { transaction },
    );
    await writePumps(sequelize, {
      supplierId: supplier.id,
      importId: record.id,
      plan: toWrite,
      fileName: options.fileName,
      fileChecksum: read.fileChecksum,
      fileUnits: read.fileUnits ?? {},
      transaction,
      onProgress,
    });
    return { ...draft, importId: record.id };
  });
}

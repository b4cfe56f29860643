import { createReadStream } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import type { Sequelize } from 'sequelize';
import type { CurveImportIssue, CurveImportList, CurveImportReport } from '../../shared/api/api-schemas';
import { describeIssue } from '../../data-import/curve-import-plan';
import {
  claimCurveImport,
  CurveImportRunningError,
  type CurveImportClaim,
  type ImportActor,
} from './curve-import-claim';
import { importCurveTable } from './curve-import-transaction';
import { exportCurveTable } from './curve-table-export-query';
import { curveTableLimits } from '../../data-import/curve-table-format';
import { currentUser } from '../accounts/authenticated-user';
import { checkedName } from '../api/checked-text';
import { ProblemError, type FieldProblem } from '../api/problem-details';
import { CurveImport, Supplier } from '../database/models';

/*
 * Curve-table uploads for one supplier: a dry run (the preview) or a commit, the history of
 * committed imports, and the current curves written back as a curve table. A supplier-admin may
 * touch only its own supplier, and a supplier has one import running at a time; both are checked
 * here, before the upload is read, so a refused caller costs nothing and writes nothing.
 *
 * Memory: the upload goes to a file of its own under the system's temporary folder (removed when
 * the request ends, whatever the outcome) and is read from there in 64 KiB chunks; the answer is
 * written pump by pump. What an import holds is the reader's and the plan's (the file's points as
 * numbers, each pump's fit and report entry: see DEVELOPERS.md), never the file's bytes or the
 * answer's text whole.
 */

/** multer for one upload, into the request's own folder; file names are read as UTF-8. */
function uploadInto(folder: string) {
  return multer({
    storage: multer.diskStorage({ destination: folder, filename: (_request, _file, named) => named(null, 'upload') }),
    limits: { fileSize: curveTableLimits.maxFileBytes, files: 1, fields: 4, parts: 6 },
    defParamCharset: 'utf8',
  }).single('file');
}

/** Runs the work with a new folder for the upload, and removes the folder and all in it afterwards. */
async function withUploadFolder<T>(work: (folder: string) => Promise<T>): Promise<T> {
  const folder = await mkdtemp(join(tmpdir(), 'riffle-curve-upload-'));
  try {
    return await work(folder);
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

/** The supplier held for this request's import, or 409 while another import of it runs. */
async function claimOrConflict(
  sequelize: Sequelize,
  supplier: Supplier,
  actor: ImportActor,
): Promise<CurveImportClaim> {
  try {
    return await claimCurveImport(sequelize, supplier, actor);
  } catch (error) {
    if (!(error instanceof CurveImportRunningError)) throw error;
    throw new ProblemError(
      409,
      'Curve import running',
      error.message,
      [{ pointer: '/path/supplierId', detail: 'has an import running' }],
      'curve-import-running',
      {
        runningImport: {
          channel: error.running.channel,
          by: error.running.by,
          startedAt: error.running.startedAt.toISOString(),
        },
      },
    );
  }
}

/** The uploaded file's own name (no folders), under the shared rule for names people type. */
function uploadedFileName(originalName: string): string {
  const name = originalName.replace(/^.*[\\/]/, '');
  return name === '' ? 'upload.csv' : checkedName(name, '/body/file').slice(0, 255);
}

/** About this many characters of the answer go to the socket at a time. */
const answerChunkCharacters = 64 * 1024;

/** The report as JSON, written a few pumps at a time: a 100,000-row preview is about 17 MiB of it. */
async function sendReport(response: Response, status: number, report: CurveImportReport): Promise<void> {
  const { pumps, ...rest } = report;
  async function* chunks(): AsyncGenerator<string> {
    let chunk = `${JSON.stringify(rest).slice(0, -1)},"pumps":[`;
    for (const [index, pump] of pumps.entries()) {
      chunk += `${index > 0 ? ',' : ''}${JSON.stringify(pump)}`;
      if (chunk.length >= answerChunkCharacters) {
        yield chunk;
        chunk = '';
      }
    }
    yield `${chunk}]}`;
  }
  response.status(status).type('application/json; charset=utf-8');
  await pipeline(Readable.from(chunks()), response).catch((error: NodeJS.ErrnoException) => {
    // A caller that hangs up before the end has nothing left to be told.
    if (error.code !== 'ERR_STREAM_PREMATURE_CLOSE') throw error;
  });
}

/** The supplier named in the path, when the caller may act for it. */
async function supplierFor(request: Request): Promise<Supplier> {
  const user = currentUser(request);
  const supplierId = Number(request.params.supplierId);
  if (user.role === 'supplier-admin' && user.supplierId !== supplierId) {
    throw new ProblemError(
      403,
      'Forbidden',
      'A supplier admin may load and read curve tables of its own supplier only',
      [{ pointer: '/path/supplierId', detail: 'not your supplier' }],
    );
  }
  const supplier = await Supplier.findByPk(supplierId);
  if (!supplier)
    throw new ProblemError(404, 'Not found', `No supplier has the id ${supplierId}`, [
      { pointer: '/path/supplierId', detail: 'no such supplier' },
    ]);
  return supplier;
}

function receiveUpload(request: Request, response: Response, folder: string): Promise<void> {
  return new Promise((resolve, reject) => {
    uploadInto(folder)(request, response, (error: unknown) => {
      if (!error) return resolve();
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return reject(
            new ProblemError(
              413,
              'File too large',
              `The file is larger than ${curveTableLimits.maxFileBytes / 1024 / 1024} MiB; split it into smaller files`,
              [{ pointer: '/body/file', detail: `at most ${curveTableLimits.maxFileBytes} bytes` }],
            ),
          );
        }
        return reject(
          new ProblemError(
            400,
            'Invalid upload',
            `${error.message}: send one file in the field "file" and optionally dryRun`,
            [{ pointer: `/body/${error.field ?? 'file'}`, detail: error.message }],
            'invalid-request',
          ),
        );
      }
      reject(
        new ProblemError(
          400,
          'Invalid upload',
          'The multipart body could not be read',
          [{ pointer: '/body', detail: (error as Error).message }],
          'invalid-request',
        ),
      );
    });
  });
}

/** `/body/file/rows/12/head`: where in the upload an issue is. */
function issuePointer(issue: CurveImportIssue): string {
  const escape = (part: string) => part.replaceAll('~', '~0').replaceAll('/', '~1');
  if (issue.row === null) return issue.column ? `/body/file/${escape(issue.column)}` : '/body/file';
  return `/body/file/rows/${issue.row}${issue.column ? `/${escape(issue.column)}` : ''}`;
}

/** The file and the dryRun flag of a received upload, or 400 naming the field. */
function uploadedFields(request: Request): { file: Express.Multer.File; dryRun: boolean } {
  const body = (request.body ?? {}) as Record<string, unknown>;
  const file = request.file;
  if (!file) {
    throw new ProblemError(
      400,
      'Invalid request',
      'A multipart/form-data body with the CSV file in the field "file" is required',
      [{ pointer: '/body/file', detail: 'a CSV file is required' }],
      'invalid-request',
    );
  }
  const dryRunField = body.dryRun ?? 'false';
  if (dryRunField !== 'true' && dryRunField !== 'false') {
    throw new ProblemError(
      400,
      'Invalid request',
      '/body/dryRun must be true or false',
      [{ pointer: '/body/dryRun', detail: 'must be one of: true, false' }],
      'invalid-request',
    );
  }
  return { file, dryRun: dryRunField === 'true' };
}

/** A refused file: 422 naming each issue's row and column, with the full report. */
function refused(report: CurveImportReport): ProblemError {
  const problems: FieldProblem[] = report.errors.map((issue) => ({
    pointer: issuePointer(issue),
    detail: describeIssue(issue),
  }));
  const count = report.errors.length + report.errorsOmitted;
  return new ProblemError(
    422,
    'Curve table refused',
    `${count} error(s), nothing was written; first: ${describeIssue(report.errors[0])}`,
    problems,
    'curve-table-refused',
    { report },
  );
}

export function createCurveImportHandlers(sequelize: Sequelize) {
  const importCurveTableHandler: RequestHandler = async (request, response) => {
    const supplier = await supplierFor(request);
    const user = currentUser(request);
    const actor: ImportActor = { userId: user.id, label: user.email, channel: 'api' };
    const claim = await claimOrConflict(sequelize, supplier, actor);
    let report: CurveImportReport;
    try {
      // The upload is read whole before the answer, so the file is gone when the caller hears back.
      report = await withUploadFolder(async (folder) => {
        await receiveUpload(request, response, folder);
        const { file, dryRun } = uploadedFields(request);
        return importCurveTable({
          sequelize,
          supplier,
          source: createReadStream(file.path),
          fileName: uploadedFileName(file.originalname),
          dryRun,
          actor,
          totalBytes: file.size,
          claim,
        });
      });
    } finally {
      await claim.release();
    }
    if (report.errors.length > 0) throw refused(report);
    await sendReport(response, report.committed ? 201 : 200, report);
  };

  const listCurveImports: RequestHandler = async (request, response) => {
    const supplier = await supplierFor(request);
    const records = await CurveImport.findAll({
      where: { supplierId: supplier.id },
      order: [['id', 'DESC']],
      limit: 200,
    });
    const answer: CurveImportList = {
      imports: records.map((record) => {
        const report = (
          typeof record.report === 'string' ? JSON.parse(record.report) : record.report
        ) as CurveImportReport;
        return {
          id: record.id,
          importedAt: record.createdAt.toISOString(),
          importedBy: record.importedBy,
          channel: record.channel,
          fileName: record.fileName,
          fileChecksum: record.fileChecksum,
          rowCount: record.rowCount,
          pumpCount: record.pumpCount,
          counts: { new: record.newCount, changed: record.changedCount, unchanged: record.unchangedCount },
          report: { ...report, importId: record.id },
        };
      }),
    };
    response.json(answer);
  };

  const exportCurveTableHandler: RequestHandler = async (request, response) => {
    const supplier = await supplierFor(request);
    const { text } = await exportCurveTable(supplier);
    response
      .type('text/csv; charset=utf-8')
      .set('Content-Disposition', `attachment; filename="${supplier.code}-curve-table.csv"`)
      .set('Cache-Control', 'no-store')
      .send(text);
  };

  return { importCurveTable: importCurveTableHandler, listCurveImports, exportCurveTable: exportCurveTableHandler };
}

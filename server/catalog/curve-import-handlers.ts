import { Readable } from 'node:stream';
import type { Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import type { Sequelize } from 'sequelize';
import type { CurveImportIssue, CurveImportList, CurveImportReport } from '../../shared/api/api-schemas';
import { describeIssue } from '../../data-import/curve-import-plan';
import { importCurveTable } from './curve-import-transaction';
import { exportCurveTable } from './curve-table-export-query';
import { curveTableLimits } from '../../data-import/curve-table-format';
import { currentUser } from '../accounts/authenticated-user';
import { ProblemError, type FieldProblem } from '../api/problem-details';
import { CurveImport, Supplier } from '../database/models';

/*
 * Curve-table uploads for one supplier: a dry run (the preview) or a commit, the history of
 * committed imports, and the current curves written back as a curve table. A supplier-admin may touch only its own supplier; that is checked here,
 * before the upload is read, so a refused caller costs nothing and writes nothing.
 */

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: curveTableLimits.maxFileBytes, files: 1, fields: 4, parts: 6 },
}).single('file');

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

function receiveUpload(request: Request, response: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    upload(request, response, (error: unknown) => {
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

export function createCurveImportHandlers(sequelize: Sequelize) {
  const importCurveTableHandler: RequestHandler = async (request, response) => {
    const supplier = await supplierFor(request);
    const user = currentUser(request);
    await receiveUpload(request, response);
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
    const fileName = (file.originalname || 'upload.csv').replace(/^.*[\\/]/, '').slice(0, 255);
    const report: CurveImportReport = await importCurveTable({
      sequelize,
      supplier,
      source: Readable.from([file.buffer]),
      fileName,
      dryRun: dryRunField === 'true',
      actor: { userId: user.id, label: user.email, channel: 'api' },
      totalBytes: file.size,
    });
    if (report.errors.length > 0) {
      const problems: FieldProblem[] = report.errors.map((issue) => ({
        pointer: issuePointer(issue),
        detail: describeIssue(issue),
      }));
      const count = report.errors.length + report.errorsOmitted;
      throw new ProblemError(
        422,
        'Curve table refused',
        `${count} error(s), nothing was written; first: ${describeIssue(report.errors[0])}`,
        problems,
        'curve-table-refused',
        { report },
      );
    }
    response.status(report.committed ? 201 : 200).json(report);
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

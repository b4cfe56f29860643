import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type {
  PumpDetail,
  PumpListQuery,
  PumpPage,
  PumpRevisionQuery,
  SupplierList,
} from '../../shared/api/api-schemas';
import { flowToSI, headToSI } from '../../shared/hydraulics';
import { siUnits } from '../../data-import/curve-import-plan';
import { ProblemError } from '../api/problem-details';
import { createPumpCatalogQueries } from './pump-catalog-queries';

/*
 * The catalog's operations: suppliers, the pump list and one pump with a curve revision. The reads
 * are in pump-catalog-queries.ts; here are the request, the checks the contract cannot state, and
 * the answer.
 */

function rangeProblem(field: 'flowMax' | 'headMax', lower: 'flowMin' | 'headMin'): ProblemError {
  return new ProblemError(
    400,
    'Invalid request',
    `/query/${field} must not be below ${lower}`,
    [{ pointer: `/query/${field}`, detail: `must not be below ${lower}` }],
    'invalid-request',
  );
}

export function createCatalogHandlers(sequelize: Sequelize) {
  const catalog = createPumpCatalogQueries(sequelize);

  const listSuppliers: RequestHandler = async (_request, response) => {
    const answer: SupplierList = { suppliers: await catalog.listSuppliers() };
    response.json(answer);
  };

  const listPumps: RequestHandler = async (request, response) => {
    const { flowUnit = 'm3/h', headUnit = 'm', ...query } = request.query as PumpListQuery;
    if (query.flowMin !== undefined && query.flowMax !== undefined && query.flowMax < query.flowMin)
      throw rangeProblem('flowMax', 'flowMin');
    if (query.headMin !== undefined && query.headMax !== undefined && query.headMax < query.headMin)
      throw rangeProblem('headMax', 'headMin');
    const flowSI = (value?: number) => (value === undefined ? undefined : flowToSI(value, flowUnit));
    const headSI = (value?: number) => (value === undefined ? undefined : headToSI(value, headUnit));
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 25;
    const { total, items } = await catalog.findPumpPage({
      ...query,
      status: query.status ?? 'active',
      flowMin: flowSI(query.flowMin),
      flowMax: flowSI(query.flowMax),
      headMin: headSI(query.headMin),
      headMax: headSI(query.headMax),
      sort: query.sort ?? 'modelCode',
      order: query.order ?? 'asc',
      page,
      pageSize,
    });
    const answer: PumpPage = { units: siUnits, total, page, pageSize, items };
    response.json(answer);
  };

  const getPump: RequestHandler = async (request, response) => {
    const pumpId = Number(request.params.pumpId);
    const wanted = (request.query as PumpRevisionQuery).revision;
    const read = await catalog.readPumpDetail(pumpId, wanted);
    if (!read.found && read.missing === 'pump')
      throw new ProblemError(404, 'Not found', `No pump has the id ${pumpId}`, [
        { pointer: '/path/pumpId', detail: 'no such pump' },
      ]);
    if (!read.found)
      throw new ProblemError(404, 'Not found', `Pump ${pumpId} has no revision ${wanted}`, [
        { pointer: '/query/revision', detail: `no such revision; this pump has ${read.revisionCount}` },
      ]);
    const answer: PumpDetail = { units: siUnits, ...read.detail };
    response.json(answer);
  };

  return { listSuppliers, listPumps, getPump };
}

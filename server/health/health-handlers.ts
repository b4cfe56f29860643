import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { Health } from '../../shared/api/api-schemas';

const databaseAnswerTimeoutMs = 2000;

/** Asks the database a real question; a hung connection counts as down after a short wait. */
async function databaseAnswers(sequelize: Sequelize): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), databaseAnswerTimeoutMs);
  });
  try {
    return await Promise.race([sequelize.query('SELECT 1').then(() => true), timeout]);
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}

export function createHealthHandlers(sequelize: Sequelize, version: string): { getHealth: RequestHandler } {
  return {
    getHealth: async (_request, response) => {
      const up = await databaseAnswers(sequelize);
      const health: Health = { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down', version };
      response
        .status(up ? 200 : 503)
        .set('Cache-Control', 'no-store')
        .json(health);
    },
  };
}

import { QueryTypes, type Sequelize } from 'sequelize';
import type { Supplier } from '../database/models';
import type { CurveImportChannel } from '../database/models/curve-import';

/*
 * One import per supplier at a time, dry run or not, across every process on the database (the
 * server, the import command, the demo seed), so that two large files never share the memory an
 * import may take and never interleave their writes. The hold is a MariaDB named lock
 * (GET_LOCK, MariaDB Knowledge Base "GET_LOCK") on a connection of its own: the server releases it
 * when that connection ends, so a crashed import never leaves its supplier held. Who holds it is
 * written beside it in running_curve_imports, for the refusal to name. Lock names are server-wide,
 * so the database's name is part of them.
 */

export interface ImportActor {
  /** The account that imports; null for the command line and the demo seed. */
  userId: number | null;
  /** Who, readably: an e-mail, or "command line (user)". */
  label: string;
  channel: CurveImportChannel;
}

/** Who started a supplier's running import, and when: what a refused second import is told. */
export interface RunningImport {
  supplierCode: string;
  channel: CurveImportChannel;
  by: string;
  startedAt: Date;
}

/** A second import of a supplier while one runs; the API answers it with 409, the command with a message. */
export class CurveImportRunningError extends Error {
  constructor(readonly running: RunningImport) {
    super(
      `an import of ${running.supplierCode}'s curve table (${running.channel}, by ${running.by}) has been running since ${running.startedAt.toISOString()}; try again when it has finished`,
    );
  }
}

/** The supplier held for one import until `release`. */
export interface CurveImportClaim {
  readonly supplierId: number;
  release(): Promise<void>;
}

/** The mariadb connector's connection, as Sequelize's connection manager hands it out. */
interface RawConnection {
  query(sql: string, values?: unknown[]): Promise<Array<Record<string, unknown>>>;
}

// SHA1 keeps the name under MariaDB's 64 characters whatever the database is called
const lockName = "CONCAT('riffle-import:', LEFT(SHA1(DATABASE()), 16), ':', ?)";

async function holder(sequelize: Sequelize, supplier: Supplier): Promise<RunningImport> {
  const [row] = await sequelize.query<{ channel: CurveImportChannel; started_by: string; started_at: Date }>(
    'SELECT channel, started_by, started_at FROM running_curve_imports WHERE supplier_id = ?',
    { replacements: [supplier.id], type: QueryTypes.SELECT },
  );
  // the holder writes its row just after taking the lock: a refusal in between still says something true
  return {
    supplierCode: supplier.code,
    channel: row?.channel ?? 'api',
    by: row?.started_by ?? 'another process',
    startedAt: row ? new Date(row.started_at) : new Date(),
  };
}

/** Holds the supplier for one import, or throws CurveImportRunningError while another holds it. */
export async function claimCurveImport(
  sequelize: Sequelize,
  supplier: Supplier,
  actor: ImportActor,
): Promise<CurveImportClaim> {
  const { connectionManager } = sequelize as unknown as {
    connectionManager: {
      getConnection(options: { type: 'write' }): Promise<RawConnection>;
      releaseConnection(connection: RawConnection): Promise<void>;
    };
  };
  const connection = await connectionManager.getConnection({ type: 'write' });
  let held = false;
  try {
    const [{ got }] = await connection.query(`SELECT GET_LOCK(${lockName}, 0) AS got`, [supplier.id]);
    held = Number(got) === 1;
    if (!held) throw new CurveImportRunningError(await holder(sequelize, supplier));
    await connection.query(
      'REPLACE INTO running_curve_imports (supplier_id, channel, started_by, started_at) VALUES (?, ?, ?, ?)',
      [supplier.id, actor.channel, actor.label.slice(0, 320), new Date()],
    );
  } catch (error) {
    if (held) await connection.query(`SELECT RELEASE_LOCK(${lockName})`, [supplier.id]).catch(() => undefined);
    await connectionManager.releaseConnection(connection);
    throw error;
  }
  let released = false;
  return {
    supplierId: supplier.id,
    release: async () => {
      if (released) return;
      released = true;
      try {
        await connection.query('DELETE FROM running_curve_imports WHERE supplier_id = ?', [supplier.id]);
        await connection.query(`SELECT RELEASE_LOCK(${lockName})`, [supplier.id]);
      } finally {
        await connectionManager.releaseConnection(connection);
      }
    },
  };
}

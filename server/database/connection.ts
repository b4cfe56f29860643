import { Sequelize } from 'sequelize';
import type { RiffleConfig } from '../config';

/** One Sequelize instance per process, talking to MariaDB through the mariadb connector. */
export function createSequelize(database: RiffleConfig['database']): Sequelize {
  return new Sequelize(database.name, database.user, database.password, {
    dialect: 'mariadb',
    host: database.host,
    port: database.port,
    logging: false,
    pool: { max: 10, min: 0, idle: 10_000, acquire: 10_000 },
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 3000 },
    define: { underscored: true },
  });
}

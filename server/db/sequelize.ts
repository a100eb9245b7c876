import { Sequelize } from 'sequelize';
import type { Config } from '../config/index';

/** One Sequelize instance per app; the caller owns its lifetime (close it on shutdown). */
export function createSequelize(db: Config['db']): Sequelize {
  return new Sequelize(db.name, db.user, db.password, {
    host: db.host,
    port: db.port,
    dialect: 'mariadb',
    logging: db.logging ? (sql) => console.log(sql) : false,
    pool: { max: 20, min: 0, idle: 10_000, acquire: 10_000 },
    dialectOptions: {
      // Fail fast when the database is down: health checks must answer quickly.
      connectTimeout: 2_000,
      // JSON columns come back as objects, not strings.
      autoJsonMap: true,
    },
    define: { underscored: true },
  });
}

import { Sequelize } from 'sequelize';

export interface DatabaseOptions {
  url: string;
  poolMax?: number;
  logging?: boolean;
}

/** One Sequelize instance per process; UTC everywhere (Sequelize sets the connection time zone). */
export function createSequelize({ url, poolMax = 20, logging = false }: DatabaseOptions): Sequelize {
  return new Sequelize(url, {
    dialect: 'mariadb',
    logging: logging ? (sql) => console.log(sql) : false,
    timezone: '+00:00',
    pool: { max: poolMax, min: 0, acquire: 10_000, idle: 10_000 },
    dialectOptions: {
      connectTimeout: 5_000,
      // A dead server should fail a query quickly (503) rather than hang it.
      socketTimeout: 30_000,
    },
    define: { underscored: true },
  });
}

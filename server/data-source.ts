import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadConfig, type Config } from './config.js';
import { entities } from './entities/index.js';
import { migrations } from './migrations/index.js';

/** Builds the TypeORM DataSource for MariaDB. Schema changes only through migrations. */
export function createDataSource(db: Config['db'] = loadConfig().db): DataSource {
  return new DataSource({
    type: 'mariadb',
    host: db.host,
    port: db.port,
    username: db.user,
    password: db.password,
    database: db.database,
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    entities,
    migrations: migrations as never,
    synchronize: false,
    migrationsRun: false,
    logging: false,
    // trace: false — mysql2 otherwise captures a stack trace on every query (for the rare failed
    // one); TypeORM's QueryFailedError names the query and its parameters anyway.
    extra: { connectionLimit: db.poolSize, connectTimeout: 5000, enableKeepAlive: true, trace: false },
  });
}

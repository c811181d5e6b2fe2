import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { config } from '../config';
import { entities } from '../entities';
import { migrations } from '../migrations';

/** One DataSource per process; migrations are explicit (never synchronize). */
export const dataSource = new DataSource({
  type: 'postgres',
  host: config.pg.host,
  port: config.pg.port,
  username: config.pg.user,
  password: config.pg.password,
  database: config.pg.database,
  entities,
  migrations,
  synchronize: false,
  logging: ['error'],
  extra: { max: 10 },
});

export async function initDataSource(): Promise<DataSource> {
  if (!dataSource.isInitialized) await dataSource.initialize();
  return dataSource;
}

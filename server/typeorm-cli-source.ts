import { createDataSource } from './data-source.js';

/**
 * The one export the TypeORM CLI needs (`npx tsx node_modules/typeorm/cli.js -d server/typeorm-cli-source.ts`).
 * A file of its own, so that importing the data source never reads the environment as a side effect.
 */
export const AppDataSource = createDataSource();

/** Config for the MikroORM CLI (`npm run migration:create`); the app builds the same options in server/orm-options.ts. */
import path from 'node:path';
import { ormOptions } from './server/orm-options';

const options = ormOptions(path.resolve(process.env.DATABASE_PATH ?? 'data/sightfan.sqlite'));
// The CLI discovers migration files from the folder; the app uses the explicit list.
export default { ...options, migrations: { ...options.migrations, migrationsList: undefined } };

import { stopPostgres } from './lib/postgres.mjs';
import { root } from './setup.mjs';

stopPostgres(root);

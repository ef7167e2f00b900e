import { stopPostgres } from './lib/postgres.mjs';
import { stopLocalServices } from './lib/services.mjs';
import { root } from './setup.mjs';

stopPostgres(root);
stopLocalServices(root);

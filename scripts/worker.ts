// The job worker: `npm start` and `npm test` run it beside the web server (see DEVELOPERS.md).
import { runWorker } from '../src/lib/server/jobs/worker';

await runWorker();

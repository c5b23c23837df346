// Entry of an engine pool worker in the compiled server (dist-server/pool-worker.js): the
// task table is already JavaScript, so no loader is needed. Under tsx, worker.mjs is used.
import { runTask } from './tasks';

export default runTask;

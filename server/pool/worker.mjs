// Entry of an engine pool worker thread. The server's TypeScript is loaded
// through tsx here (workers do not inherit the web thread's loader), then
// the task table; piscina calls the default export with each task.
import { fileURLToPath, URL } from 'node:url';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)) });
const { runTask } = await import('./tasks.ts');

export default runTask;

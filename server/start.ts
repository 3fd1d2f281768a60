/**
 * `npm start`: builds the client only when a source changed since the last build, then starts
 * the server (migrate, seed the demo in demo mode, listen). The server is loaded after the build
 * so a failed build never leaves a half-started server.
 */
import { readConfig } from './config';
import { ensureClientBuild } from './client-build';

ensureClientBuild(readConfig().clientDir);
// eslint-disable-next-line @typescript-eslint/no-require-imports
require('./main');

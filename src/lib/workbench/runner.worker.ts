// the run in a web worker: the engine off the main thread, exposed with comlink.
// results come back as transferred Float64Array buffers (no copy).
import * as Comlink from 'comlink';
import { runnerApi } from './runnerApi.ts';

Comlink.expose(runnerApi);

// the compare and sensitivity runs in a web worker (one of the pool's), exposed with comlink
import * as Comlink from 'comlink';
import { compareApi } from './compareApi.ts';

Comlink.expose(compareApi);

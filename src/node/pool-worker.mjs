// Entry of a pool worker thread (src/node/pool.ts): loads the TypeScript worker through tsx's loader, as
// bin/dryhours.mjs does for the command (no build step).
import { register } from 'tsx/esm/api'

register()
await import('./pool-worker.ts')

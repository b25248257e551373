// Worker-thread main module of the render pool (renderPool.ts). Node checks a worker's main file
// extension before any loader hook runs, so a TypeScript entry cannot be the main module; this file
// is plain CommonJS and requires the TypeScript entry through the tsx hooks the pool's execArgv loads.
require('./worker.ts');

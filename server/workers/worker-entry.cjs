// Worker-thread entry: registers tsx so the TypeScript task modules load the same way under `tsx`, vitest and
// `npm start`, then hands over to worker-main.ts.
require('tsx/cjs/api').register();
require('./worker-main.ts');

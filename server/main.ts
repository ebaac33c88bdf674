// Starts Phasewright: `npm start` runs this after making sure the web app is built.
import { readConfig } from './config';
import { startServer, DEMO_PASSWORD } from './app';

async function main() {
  const started = Date.now();
  const config = readConfig();
  const server = await startServer(config);
  if (server.seeded) {
    console.log('Demo data created. Sign in with any of these (password: ' + DEMO_PASSWORD + '):');
    for (const u of server.seeded) console.log(`  ${u.role.padEnd(6)} ${u.email}`);
  }
  if (server.mailer.kind === 'local-sink') {
    console.log(`Mail is caught by the local sink: see ${config.publicUrl}/outbox (from this machine only).`);
  }
  console.log(`Database: ${server.database.kind === 'pglite' ? `PGlite in ${config.dataDir}` : 'PostgreSQL (DATABASE_URL)'}`);
  console.log(`Started in ${Date.now() - started} ms.`);
  console.log(`Phasewright listening on ${config.publicUrl}`);

  const stop = async (signal: string) => {
    console.log(`${signal}: shutting down`);
    await server.close();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop('SIGINT'));
  process.once('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

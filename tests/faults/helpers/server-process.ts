// The app server as a child process of a fault test: the real startServer with a
// configuration read from the environment, so the test can SIGKILL it, watch its
// PID and memory, and start it again. Output goes to the log file the parent opened.
import { loadConfig } from '../../../server/config/env';
import { startServer } from '../../../server/index';

process.on('uncaughtException', (error) => {
  console.error(`${new Date().toISOString()} UNCAUGHT`, error);
  process.exit(70);
});
process.on('unhandledRejection', (error) => {
  console.error(`${new Date().toISOString()} UNHANDLED REJECTION`, error);
  process.exit(70);
});

const config = loadConfig(process.env);
// No client build: the fault tests exercise the API only.
const running = await startServer(config, { clientDir: '/nonexistent-client-dir' });
console.log(`${new Date().toISOString()} listening ${running.url} pid ${process.pid}`);

const stop = async () => {
  // A clean exit within 3 s whatever close() waits for: --cpu-prof writes its profile only on exit.
  setTimeout(() => process.exit(0), 3_000).unref();
  await running.close().catch((error) => console.error('close failed', error));
  process.exit(0);
};
process.on('SIGTERM', () => void stop());
process.on('SIGINT', () => void stop());

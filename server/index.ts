import type { Server } from 'node:http';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config';
import { createDeps } from './deps';
import { createLogger } from './logger';
import { closeGracefully, prepareHttpServer } from './http/server-settings';

process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(2);
    }
    throw err;
  }
  const logger = createLogger(config.LOG_LEVEL);
  const deps = createDeps(config, logger);
  await deps.queue.start();
  const app = createApp(deps);
  const server: Server = app.listen(config.PORT, config.HOST, () => {
    logger.info({ url: `http://${config.HOST}:${config.PORT}` }, 'Rivet & Reel is listening');
  });
  prepareHttpServer(server);

  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'shutting down: finishing in-flight requests');
    // Stop accepting; idle keep-alive connections close now, busy ones once their response is sent.
    closeGracefully(server).then(
      async () => {
        try {
          await deps.close();
          logger.info('shut down cleanly');
          process.exit(0);
        } catch (err) {
          logger.error({ err }, 'error during shutdown');
          process.exit(1);
        }
      },
      (err: unknown) => {
        logger.error({ err }, 'error during shutdown');
        process.exit(1);
      },
    );
    setTimeout(() => {
      logger.warn('forcing shutdown after 20 s');
      process.exit(1);
    }, 20_000).unref();
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});

// A small leveled logger; request bodies are never logged.
type Level = 'silent' | 'error' | 'info' | 'debug';
const order: Record<Level, number> = { silent: 0, error: 1, info: 2, debug: 3 };

export interface Logger {
  error(message: string, meta?: unknown): void;
  info(message: string, meta?: unknown): void;
  debug(message: string, meta?: unknown): void;
}

export function createLogger(level: Level): Logger {
  const at = order[level];
  const write = (name: Level, message: string, meta?: unknown) => {
    if (order[name] > at) return;
    const line = `${new Date().toISOString()} ${name.toUpperCase()} ${message}`;
    if (name === 'error') console.error(line, meta ?? '');
    else console.log(line, meta ?? '');
  };
  return {
    error: (message, meta) => write('error', message, meta),
    info: (message, meta) => write('info', message, meta),
    debug: (message, meta) => write('debug', message, meta),
  };
}

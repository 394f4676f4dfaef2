import { appendFileSync, mkdirSync } from 'node:fs';
import { dirname } from 'node:path';

export type LogLevel = 'info' | 'warn' | 'error';

export interface HostLog {
  info(event: string, fields?: Record<string, unknown>): void;
  warn(event: string, fields?: Record<string, unknown>): void;
  error(event: string, fields?: Record<string, unknown>): void;
}

export interface LogRecord {
  readonly time: string;
  readonly level: LogLevel;
  readonly event: string;
  readonly fields: Record<string, unknown>;
}

/**
 * JSON lines in the data folder's log file; warnings and errors also go to standard error
 * as one readable line, so an operator running browser mode in a terminal sees refusals.
 */
export function createHostLog(options: { file: string | null; echo: boolean; sink?: (record: LogRecord) => void }): HostLog {
  if (options.file) mkdirSync(dirname(options.file), { recursive: true });
  const write = (level: LogLevel, event: string, fields: Record<string, unknown> = {}): void => {
    const record: LogRecord = { time: new Date().toISOString(), level, event, fields };
    options.sink?.(record);
    if (options.file) appendFileSync(options.file, `${JSON.stringify(record)}\n`);
    if (options.echo && level !== 'info') {
      const detail = Object.entries(fields)
        .filter(([key]) => key !== 'stack')
        .map(([key, value]) => `${key}=${typeof value === 'string' ? value : JSON.stringify(value)}`)
        .join(' ');
      process.stderr.write(`gazeloom ${level}: ${event}${detail ? ` ${detail}` : ''}\n`);
    }
  };
  return {
    info: (event, fields) => write('info', event, fields),
    warn: (event, fields) => write('warn', event, fields),
    error: (event, fields) => write('error', event, fields),
  };
}

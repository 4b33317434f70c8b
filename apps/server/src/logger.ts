/** Minimal structured logger; the server never prints internal errors to clients, only here. */
export interface Logger {
  debug(message: string, fields?: Record<string, unknown>): void;
  info(message: string, fields?: Record<string, unknown>): void;
  warn(message: string, fields?: Record<string, unknown>): void;
  error(message: string, fields?: Record<string, unknown>): void;
}

const ORDER = { debug: 0, info: 1, warn: 2, error: 3 } as const;
export type LogLevel = keyof typeof ORDER;

export function createConsoleLogger(level: LogLevel = "info"): Logger {
  const emit = (at: LogLevel, message: string, fields?: Record<string, unknown>) => {
    if (ORDER[at] < ORDER[level]) return;
    const line =
      fields && Object.keys(fields).length > 0 ? `${message} ${safeJson(fields)}` : message;
    (at === "error" ? console.error : at === "warn" ? console.warn : console.log)(
      `[${new Date().toISOString()}] ${at.padEnd(5)} ${line}`,
    );
  };
  return {
    debug: (m, f) => emit("debug", m, f),
    info: (m, f) => emit("info", m, f),
    warn: (m, f) => emit("warn", m, f),
    error: (m, f) => emit("error", m, f),
  };
}

export const silentLogger: Logger = {
  debug: () => undefined,
  info: () => undefined,
  warn: () => undefined,
  error: () => undefined,
};

function safeJson(fields: Record<string, unknown>): string {
  try {
    return JSON.stringify(fields, (_k, v: unknown) =>
      v instanceof Error ? { name: v.name, message: v.message, stack: v.stack } : v,
    );
  } catch {
    return "[unserialisable fields]";
  }
}

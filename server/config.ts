/** Runtime configuration, read once from the environment. Every value has a local default. */
export interface AppConfig {
  readonly port: number;
  readonly host: string;
  readonly db: {
    readonly host: string;
    readonly port: number;
    readonly name: string;
    readonly user: string;
    readonly password: string;
  };
  readonly sessionSecret: string;
  /** Idle expiry of a session in milliseconds. */
  readonly sessionIdleMs: number;
  /** Express `trust proxy` setting: false, true, a hop count or a list of addresses. */
  readonly trustProxy: boolean | number | string;
  /** Serve cookies with the Secure flag (set when the app sits behind TLS). */
  readonly secureCookies: boolean;
  readonly demoPassword: string;
  /** Folder of the built Angular app, or null to serve the API only. */
  readonly staticDir: string | null;
  readonly calcRateLimitPerMinute: number;
  readonly publicUrl: string;
  readonly smtp: { readonly host: string; readonly port: number; readonly secure: boolean; readonly user?: string; readonly password?: string; readonly from: string };
  /** True while the local SMTP catcher is in use: enables the dev mailbox page. */
  readonly mailFake: boolean;
  readonly uploads: {
    readonly driver: 'disk' | 's3';
    readonly dir: string;
    readonly maxBytes: number;
    readonly s3?: { readonly endpoint: string; readonly bucket: string; readonly region: string; readonly accessKeyId: string; readonly secretAccessKey: string };
  };
  /** Removal of upload files no attachment refers to (left by a crash mid-upload). */
  readonly uploadSweep: {
    /** Time between sweeps in milliseconds; 0 = no timer. */
    readonly everyMs: number;
    /** Files younger than this are never removed: an upload stores its file before its row commits. */
    readonly graceMs: number;
  };
}

function int(value: string | undefined, fallback: number): number {
  const n = value === undefined || value === '' ? NaN : Number(value);
  return Number.isInteger(n) ? n : fallback;
}

/** A whole number of minutes from `min` to `max`, or the fallback when unset; anything else is refused by name. */
function minutes(env: NodeJS.ProcessEnv, name: string, fallback: number, min: number, max: number): number {
  const value = env[name];
  if (value === undefined || value.trim() === '') return fallback;
  const n = /^\d{1,7}$/.test(value.trim()) ? Number(value.trim()) : NaN;
  if (!Number.isInteger(n) || n < min || n > max) throw new Error(`${name} must be a whole number of minutes from ${min} to ${max} (got "${value}").`);
  return n;
}

function trustProxy(value: string | undefined): boolean | number | string {
  if (value === undefined || value === '' || value === 'false') return false;
  if (value === 'true') return true;
  const n = Number(value);
  return Number.isInteger(n) ? n : value;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const port = int(env['PORT'], 4300);
  return {
    port,
    host: env['HOST'] ?? '127.0.0.1',
    db: {
      host: env['DB_HOST'] ?? '127.0.0.1',
      port: int(env['DB_PORT'], 3407),
      name: env['DB_NAME'] ?? 'slantwise',
      user: env['DB_USER'] ?? 'slantwise',
      password: env['DB_PASSWORD'] ?? 'slantwise-local',
    },
    sessionSecret: env['SESSION_SECRET'] ?? 'slantwise-local-session-secret-change-me',
    sessionIdleMs: int(env['SESSION_IDLE_MINUTES'], 120) * 60_000,
    trustProxy: trustProxy(env['TRUST_PROXY']),
    secureCookies: env['SECURE_COOKIES'] === 'true',
    demoPassword: env['DEMO_PASSWORD'] ?? 'kestrel-demo-2026',
    staticDir: env['STATIC_DIR'] === '' ? null : (env['STATIC_DIR'] ?? 'dist/slantwise/browser'),
    calcRateLimitPerMinute: int(env['CALC_RATE_LIMIT'], 600),
    publicUrl: env['PUBLIC_URL'] ?? `http://127.0.0.1:${port}`,
    smtp: {
      host: env['SMTP_HOST'] ?? '127.0.0.1',
      port: int(env['SMTP_PORT'], 2525),
      secure: env['SMTP_SECURE'] === 'true',
      user: env['SMTP_USER'] || undefined,
      password: env['SMTP_PASSWORD'] || undefined,
      from: env['MAIL_FROM'] ?? 'Slantwise <no-reply@slantwise.test>',
    },
    mailFake: (env['MAIL_FAKE'] ?? 'true') === 'true',
    uploads: {
      driver: env['STORAGE_DRIVER'] === 's3' ? 's3' : 'disk',
      dir: env['UPLOAD_DIR'] ?? '.data/uploads',
      maxBytes: int(env['UPLOAD_MAX_MB'], 20) * 1024 * 1024,
      s3: env['S3_BUCKET']
        ? {
            endpoint: env['S3_ENDPOINT'] ?? '',
            bucket: env['S3_BUCKET'],
            region: env['S3_REGION'] ?? 'us-east-1',
            accessKeyId: env['S3_ACCESS_KEY_ID'] ?? '',
            secretAccessKey: env['S3_SECRET_ACCESS_KEY'] ?? '',
          }
        : undefined,
    },
    uploadSweep: {
      // Off under jest (NODE_ENV=test) unless a test sets it; at most a week (a timer's limit is 24.8 days).
      everyMs: minutes(env, 'UPLOAD_SWEEP_MINUTES', env['NODE_ENV'] === 'test' ? 0 : 60, 0, 10_080) * 60_000,
      graceMs: minutes(env, 'UPLOAD_SWEEP_GRACE_MINUTES', 60, 1, 525_600) * 60_000,
    },
  };
}

import { Op } from 'sequelize';
import { LoginFailure } from '../models/login-failure';

export interface ThrottleRule {
  /** Failures allowed inside the window before sign-in is refused. */
  readonly limit: number;
  readonly windowMs: number;
}

/**
 * Counts failed sign-ins per key ("account:<email>", "ip:<address>") in MariaDB, so every app
 * instance sees the same counts. A key is blocked once its count inside the window reaches the limit.
 */
export class LoginThrottle {
  constructor(private readonly rule: ThrottleRule) {}

  /** Seconds until the first blocked key frees up, or 0 when none is blocked. */
  async retryAfter(keys: readonly string[], now = new Date()): Promise<number> {
    const since = new Date(now.getTime() - this.rule.windowMs);
    const rows = await LoginFailure.findAll({ where: { key: { [Op.in]: [...keys] }, windowStart: { [Op.gt]: since } } });
    const blocked = rows.filter((r) => r.count >= this.rule.limit);
    if (!blocked.length) return 0;
    const until = Math.max(...blocked.map((r) => r.windowStart.getTime() + this.rule.windowMs));
    return Math.max(1, Math.ceil((until - now.getTime()) / 1000));
  }

  async recordFailure(keys: readonly string[], now = new Date()): Promise<void> {
    const since = new Date(now.getTime() - this.rule.windowMs);
    for (const key of keys) {
      // One statement per key: insert, restart an expired window, or count up.
      await LoginFailure.sequelize!.query(
        `INSERT INTO login_failures (\`key\`, \`count\`, windowStart) VALUES (?, 1, ?)
         ON DUPLICATE KEY UPDATE \`count\` = IF(windowStart <= ?, 1, \`count\` + 1), windowStart = IF(windowStart <= ?, VALUES(windowStart), windowStart)`,
        { replacements: [key, now, since, since] },
      );
    }
  }

  async clear(keys: readonly string[]): Promise<void> {
    await LoginFailure.destroy({ where: { key: { [Op.in]: [...keys] } } });
  }
}

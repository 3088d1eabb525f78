import type { Config } from '../server/core/config';
import type { JobQueue } from '../server/core/queue';

/**
 * Recurring jobs, registered by every worker at start (pg-boss keeps one schedule per name, so this
 * is an upsert, and its cron monitor sends each tick once however many workers run).
 */
export async function registerSchedules(queue: JobQueue, config: Pick<Config, 'weeklySummary'>): Promise<void> {
  if (config.weeklySummary) await queue.boss.schedule('summary.weekly-all', config.weeklySummary.cron, {}, { tz: config.weeklySummary.timeZone });
  else await queue.boss.unschedule('summary.weekly-all');
}

// A job record as the API answers it (GET /v1/jobs/{id}, the list, and completion callbacks).
import type { JobAnswer } from '../schemas/batch.js';
import { jobLinks, type JobRecord } from './queue.js';

/** Now plus the items left at the rate seen since the job started; null unless running with progress. */
function estimatedFinish(job: JobRecord, nowMs: number): string | null {
  if (job.status !== 'running' || job.startedAt === null || job.done === 0) return null;
  const elapsedMs = Math.max(0, nowMs - Date.parse(job.startedAt));
  return new Date(nowMs + (elapsedMs / job.done) * (job.items - job.done)).toISOString();
}

export const toAnswer = (job: JobRecord, nowMs = Date.now()): JobAnswer => ({
  id: job.id,
  label: job.label,
  status: job.status,
  counts: { items: job.items, done: job.done, failed: job.failed },
  progress: { fraction: job.items === 0 ? 1 : job.done / job.items, estimatedFinishAt: estimatedFinish(job, nowMs) },
  attempts: job.attempts,
  createdAt: job.createdAt,
  startedAt: job.startedAt,
  finishedAt: job.finishedAt,
  deadline: job.deadline,
  compareTo: job.compareTo?.job ?? null,
  callbackUrl: job.callbackUrl,
  error: job.error,
  links: jobLinks(job.id),
});

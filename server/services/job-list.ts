/** The background jobs a user started, a page at a time, without their results. */
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { JobListQuery, JobSummary } from '@shared/schemas/jobs';
import { EvaluationJob } from '../models';
import { afterCursor, containsAny, keyAttributes, keyOrder, pageOf, byCreation } from './keyset';

const JOB_ORDERS = byCreation('EvaluationJob');

/**
 * One page of the user's jobs, newest first by default
 * (evaluation_jobs_user_created_idx serves both orders); `kind` and `status`
 * filter, `q` matches part of the kind or the status. A user has few jobs, so
 * the search filters the index range of the user's rows.
 */
export async function listJobs(
  userId: string,
  query: JobListQuery & { limit: number; sort: 'newest' | 'oldest' },
  transaction: Transaction | null,
): Promise<{ items: EvaluationJob[]; nextCursor: string | null }> {
  const order = JOB_ORDERS[query.sort];
  const conditions: WhereOptions[] = [{ userId }];
  if (query.kind) conditions.push({ kind: query.kind });
  if (query.status) conditions.push({ status: query.status });
  if (query.q)
    conditions.push(containsAny(['"EvaluationJob"."kind"', '"EvaluationJob"."status"'], query.q));
  if (query.cursor) conditions.push(afterCursor(order, query.cursor));
  const rows = await EvaluationJob.findAll({
    where: { [Op.and]: conditions },
    attributes: { exclude: ['input', 'result'], include: keyAttributes(order) },
    order: keyOrder(order),
    limit: query.limit + 1,
    transaction,
  });
  return pageOf(rows, query.limit, order);
}

export function presentJobSummary(job: EvaluationJob): JobSummary {
  return {
    id: job.id,
    kind: job.kind,
    status: job.status,
    progress: job.progress,
    ...(job.error ? { error: job.error } : {}),
    createdAt: job.createdAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
  };
}

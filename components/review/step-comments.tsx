/**
 * The review's comments on one wizard step, shown on the step itself: where the approver reads
 * the data and leaves a comment, and where the specialist fixes it and answers. Nothing shows
 * while the step has no comments and the person cannot start one.
 */
import type { FilingDetail } from '../../constants/schemas/filings';
import { useReviewQuery } from '../../hooks/queries/review';
import { threadsOn } from '../filings/filing-pages';
import { Card } from '../ui/card';
import { CommentThreads } from './comment-threads';

export function StepComments({ filing, step }: { filing: FilingDetail; step: string }) {
  const review = useReviewQuery(filing.id);
  if (!review.data) return null;
  const here = threadsOn(review.data.threads, step);
  if (!here.length && !review.data.can.comment.allowed) return null;
  return (
    <Card title="Review comments on this step" testID="step-comments">
      <CommentThreads filing={filing} review={review.data} step={step} />
    </Card>
  );
}

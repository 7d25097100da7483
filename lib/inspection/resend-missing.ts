// When signing is refused because the server lacks steps the phone recorded (they never
// arrived, or the server lost them before they reached its disk), the phone sends those steps
// again from its own copy of the walk and then signs again. Pure: the walk page carries it out.
import type { QueuedRequest } from './flush-queue';
import type { WalkStep } from './store';

/** After this many rounds the refusal is shown to the driver instead of being retried. */
export const maxResendRounds = 3;

export type ResendPlan = {
  /** The refused signature, to take out of the outbox. */
  dropKey: string;
  /** Steps to send again, in walk order. */
  steps: WalkStep[];
  /** The signature to send after them: the same, naming only steps the server can take. */
  finishJson: Record<string, unknown> & { stepIds: string[] };
  round: number;
};

type FinishJson = Record<string, unknown> & { stepIds?: string[] };

export function planResend({
  outbox,
  steps,
  finishUrl,
}: {
  outbox: QueuedRequest[];
  steps: WalkStep[];
  finishUrl: string;
}): ResendPlan | null {
  const refusedFinish = outbox.find(
    (r) => r.url === finishUrl && r.state === 'failed' && (r.errorFields?.stepIds?.length ?? 0) > 0,
  );
  if (!refusedFinish) return null;
  const round = (refusedFinish.resendRound ?? 0) + 1;
  if (round > maxResendRounds) return null;
  const json = refusedFinish.json as FinishJson;
  if (!json?.stepIds) return null;
  // A step the server refused for good (a 4xx kept in the outbox) cannot be sent again: the
  // signature stops naming it, and the driver sees that refusal instead.
  const refusedSteps = new Set(
    outbox
      .filter((r) => r.state === 'failed' && r.url.endsWith('/steps'))
      .map((r) => (r.json as { id?: string } | undefined)?.id)
      .filter((id): id is string => !!id),
  );
  const onPhone = new Set(steps.map((s) => s.id));
  const missing = new Set(refusedFinish.errorFields?.stepIds);
  const resend = steps.filter((s) => missing.has(s.id) && !refusedSteps.has(s.id));
  // Named steps the phone no longer holds, or that were refused, are dropped from the list.
  const stepIds = json.stepIds.filter((id) => onPhone.has(id) && !refusedSteps.has(id));
  if (resend.length === 0 && stepIds.length === json.stepIds.length) return null;
  return {
    dropKey: refusedFinish.key,
    steps: resend.sort((a, b) => a.seq - b.seq),
    finishJson: { ...json, stepIds },
    round,
  };
}

'use client';
import { enqueueRequest } from '@/lib/inspection/device-queue';
import { toStepBody, type WalkStep } from '@/lib/inspection/store';

/** One step into the device outbox, on its way to the server. */
export const enqueueStep = (inspectionId: string, step: WalkStep) =>
  enqueueRequest({
    label: step.label ?? step.kind,
    url: `/api/inspections/${inspectionId}/steps`,
    method: 'POST',
    json: toStepBody(step),
  });

// The confound audit, off the main thread so the space view stays responsive. Messages:
// in { definition, thresholds? } → out { type: 'progress', fraction } … then { type: 'result', audit } or { type: 'error', message }.
import { auditSpace } from '../space/audit-space';
import type { AuditThresholds, SpaceDefinition } from '../space/types';

interface AuditRequest {
  definition: SpaceDefinition;
  thresholds?: Partial<AuditThresholds>;
}

self.onmessage = (event: MessageEvent<AuditRequest>) => {
  try {
    const audit = auditSpace(event.data.definition, {
      ...(event.data.thresholds ? { thresholds: event.data.thresholds } : {}),
      onProgress: (fraction: number) => self.postMessage({ type: 'progress', fraction }),
    });
    self.postMessage({ type: 'result', audit });
  } catch (error) {
    self.postMessage({ type: 'error', message: error instanceof Error ? error.message : 'The audit failed.' });
  }
};

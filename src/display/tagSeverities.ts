import type { WarningSeverity } from '../../shared/schemas/analysis';
import type { Severity } from '../../shared/schemas/annotation';
import type { CaptureStatus } from '../../shared/schemas/capture';

/** PrimeVue's colour names for tags and messages. */
type TagSeverity = 'secondary' | 'info' | 'success' | 'warn' | 'danger';

// Records over the shared enums: a status or severity added there fails the type check here until it has a look.

/** How a capture's status shows, including an upload still on its way. */
export const CAPTURE_STATUS_TAG: Record<CaptureStatus | 'uploading', { severity: TagSeverity; icon: string }> = {
  uploading: { severity: 'info', icon: 'pi pi-upload' },
  queued: { severity: 'secondary', icon: 'pi pi-clock' },
  processing: { severity: 'info', icon: 'pi pi-spin pi-cog' },
  ready: { severity: 'success', icon: 'pi pi-check' },
  failed: { severity: 'danger', icon: 'pi pi-times' },
};

/** A mark's severity, as a tag colour and a word. */
export const MARK_SEVERITY: Record<Severity, { severity: TagSeverity; label: string }> = {
  info: { severity: 'info', label: 'Info' },
  warning: { severity: 'warn', label: 'Warning' },
  fault: { severity: 'danger', label: 'Fault' },
};

/** An analysis warning's severity, as PrimeVue's message colour. */
export const WARNING_MESSAGE: Record<WarningSeverity, 'info' | 'warn' | 'error'> = { info: 'info', warning: 'warn', danger: 'error' };

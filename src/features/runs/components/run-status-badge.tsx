import type { RunStatus } from '../../../../shared/contracts/runs.ts';
import { Badge } from '../../../components/ui/badge.tsx';
import { RUN_STATUS_TEXT } from './run-text.ts';

/** A run's status as a word; a running run also says how far it has got. */
export function RunStatusBadge({ status, progress }: { status: RunStatus; progress?: number }) {
  const text = RUN_STATUS_TEXT[status];
  const percent = status === 'running' && progress !== undefined ? ` ${Math.floor(progress * 100)}%` : '';
  return (
    <Badge tone={text.tone}>
      {text.label}
      {percent}
    </Badge>
  );
}

import type { CampaignRole } from '@contracts/campaigns';
import { ROLE_LABELS } from '@/lib/format';
import { Badge } from './badge';

const ROLE_TONES = { lead: 'ember', reader: 'blue', observer: 'ink' } as const;

export function RoleBadge({ role }: { role: CampaignRole }) {
  return <Badge tone={ROLE_TONES[role]}>{ROLE_LABELS[role]}</Badge>;
}

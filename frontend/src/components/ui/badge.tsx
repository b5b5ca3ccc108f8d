import type { ReactNode } from 'react';

const TONES = {
  ember: 'bg-ember-50 text-ember-700 border-ember-100',
  blue: 'bg-blueend-50 text-blueend-700 border-blueend-100',
  ink: 'bg-paper-200 text-ink-700 border-paper-300',
  danger: 'bg-danger-100 text-danger-700 border-danger-600/30',
  success: 'bg-success-100 text-success-700 border-success-700/20',
} as const;

export function Badge({ tone = 'ink', children }: { tone?: keyof typeof TONES; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center rounded-full border px-2 py-px text-xs font-medium ${TONES[tone]}`}>
      {children}
    </span>
  );
}

import type { ReactNode } from 'react';
import { isApiError } from '@/lib/api-client';

const TONES = {
  danger: 'border-danger-600/40 bg-danger-100 text-danger-700',
  success: 'border-success-700/30 bg-success-100 text-success-700',
  warning: 'border-warning-700/30 bg-warning-100 text-warning-700',
  info: 'border-blueend-500/30 bg-blueend-50 text-blueend-700',
} as const;

interface NoticeProps {
  tone: keyof typeof TONES;
  title?: string;
  children: ReactNode;
  /** alert interrupts a screen reader (failures); status waits politely (confirmations). */
  role?: 'alert' | 'status';
}

export function Notice({ tone, title, children, role }: NoticeProps) {
  return (
    <div role={role} className={`rounded-control border px-3 py-2 text-base ${TONES[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      <div>{children}</div>
    </div>
  );
}

/** The server's own sentence is the most useful thing to show; anything else gets a plain fallback. */
export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong. Try again.';
}

export function ErrorNotice({ error, title }: { error: unknown; title?: string }) {
  if (!error) return null;
  return (
    <Notice tone="danger" role="alert" {...(title ? { title } : {})}>
      {errorMessage(error)}
    </Notice>
  );
}

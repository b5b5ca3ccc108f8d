import { useQuery } from '@tanstack/react-query';
import { getHealthQueryOptions } from '@/lib/health';

export function Footer() {
  const health = useQuery(getHealthQueryOptions());
  return (
    <footer className="border-t border-paper-300 py-3">
      <p className="mx-auto max-w-6xl px-5 text-xs text-ink-500">
        Redward{health.data ? <span className="num"> {health.data.version}</span> : null}
        {health.isError ? <span className="text-danger-700"> · the server did not answer its health check</span> : null}
      </p>
    </footer>
  );
}

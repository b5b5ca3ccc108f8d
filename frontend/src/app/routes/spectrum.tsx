import { useParams } from 'react-router-dom';
import { SpectrumInspector } from '@/features/inspect/components/spectrum-inspector';
import { NotFoundRoute } from './not-found';

/** Loaded lazily (see router.tsx), like the queue's inspection route. */
export function SpectrumRoute() {
  const id = Number(useParams().spectrumId);
  if (!Number.isInteger(id) || id <= 0) return <NotFoundRoute />;
  return <SpectrumInspector key={id} spectrumId={id} />;
}

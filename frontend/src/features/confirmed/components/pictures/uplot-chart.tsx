import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

/** A small uPlot chart that rebuilds when its options or data change (these pictures are redrawn rarely). */
export function UPlotChart({ options, data, label, describedBy }: { options: Omit<uPlot.Options, 'width'>; data: uPlot.AlignedData; label: string; describedBy: string }) {
  const host = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = host.current!;
    const u = new uPlot({ ...options, width: el.clientWidth || 480 }, data, el);
    const resize = new ResizeObserver(() => el.clientWidth > 0 && el.clientWidth !== u.width && u.setSize({ width: el.clientWidth, height: options.height }));
    resize.observe(el);
    return () => (resize.disconnect(), u.destroy());
  }, [options, data]);
  return <div ref={host} role="img" aria-label={label} aria-describedby={describedBy} className="w-full" />;
}

/**
 * Calls `onDrawn` once, in the animation frame after React Flow has first measured (and so shown)
 * every node of the plan; at once for a plan without nodes. Watches React Flow's store only until
 * then, so it costs nothing while editing.
 */
import { useEffect, useRef } from 'react';
import { useStoreApi } from 'reactflow';

export function useWhenDrawn(onDrawn: (() => void) | undefined): void {
  const flow = useStoreApi();
  const onDrawnRef = useRef(onDrawn);
  onDrawnRef.current = onDrawn;
  useEffect(() => {
    let frame = 0;
    const drawn = () => flow.getState().getNodes().every((n) => n.width && n.height);
    const report = () => {
      frame = requestAnimationFrame(() => onDrawnRef.current?.());
    };
    if (drawn()) {
      report();
      return () => cancelAnimationFrame(frame);
    }
    const stop = flow.subscribe(() => {
      if (!drawn()) return;
      stop();
      report();
    });
    return () => {
      stop();
      cancelAnimationFrame(frame);
    };
  }, [flow]);
}

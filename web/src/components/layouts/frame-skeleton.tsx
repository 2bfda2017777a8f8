import { ShadowloopMark } from '../ui/shadowloop-mark';
import { FrameGrid } from './signed-in-frame';

/** Shown while the signed-in user is loading, with the frame's shape so nothing jumps. */
export function FrameSkeleton() {
  return (
    <FrameGrid
      top={
        <header className="col-span-2 flex items-center gap-2 border-b border-rule border-t-4 border-t-twin bg-panel px-4 py-2">
          <ShadowloopMark size={26} />
          <span className="text-lg font-bold">Shadowloop</span>
        </header>
      }
      nav={<div className="border-r border-rule bg-panel" />}
    >
      <p role="status" className="text-sm text-ink/75">
        Loading Shadowloop…
      </p>
    </FrameGrid>
  );
}

import { schedule } from './lease-keeper.js';
import { createLoopTwin, type LoopTwin } from './loop-twin.js';
import { catchUpPlan, lastDueSlot, periodMsOf } from './slot-clock.js';
import { coast, jump } from './twin-step.js';
import { swapLoopTwin } from './twin-swap.js';
import { graceMs, type TwinRuntime } from './twin-runtime.js';

/** One loop's share of a tick: the slots it steps with their readings. */
export interface TickWork {
  twin: LoopTwin;
  fromK: number;
  toK: number;
}

/**
 * Readies a due loop for the tick: checks its lease, switches to a newly active version (the
 * registry makes it visible at the slot boundary, so it takes over at this slot), and plans the
 * catch-up when slots were missed, coasting the older part of a long gap right here.
 */
export function prepareLoop(rt: TwinRuntime, loopId: string, nowMs: number): TickWork | undefined {
  let twin = rt.twins.get(loopId);
  if (!twin) return undefined;
  const lease = rt.leases.get(loopId);
  const incoming = rt.models.get(loopId);
  if (!lease || lease.validUntilMs < nowMs || !incoming) {
    // not ours for sure right now, or no active version: the lease cycle decides; look again later
    rt.wheel.schedule(loopId, nowMs + rt.options.leaseIntervalMs);
    return undefined;
  }
  if (incoming.version.id !== twin.active.version.id) twin = switchVersion(rt, twin, incoming, nowMs);
  const last = lastDueSlot(nowMs, twin.periodMs, graceMs(rt, twin));
  const plan = catchUpPlan(twin.next, last, rt.options.catchUp);
  if (plan.stepTo < plan.stepFrom) {
    schedule(rt, twin);
    return undefined;
  }
  if (plan.jump || plan.coast > rt.options.catchUp.maxStepped) {
    rt.log(
      `${twin.active.loopTag}: ${plan.coast + plan.jump} slots behind; coasting ${plan.coast} on held inputs` +
        (plan.jump ? ` and jumping ${plan.jump} with the state kept` : ''),
    );
  }
  jump(twin, plan.jump);
  coast(twin, plan.coast);
  return { twin, fromK: plan.stepFrom, toK: plan.stepTo };
}

function switchVersion(
  rt: TwinRuntime,
  current: LoopTwin,
  incoming: NonNullable<ReturnType<TwinRuntime['models']['get']>>,
  nowMs: number,
): LoopTwin {
  const from = current.active.version.number;
  let twin: LoopTwin;
  let reason: string;
  if (periodMsOf(incoming.samplePeriodS) !== current.periodMs) {
    const periodMs = periodMsOf(incoming.samplePeriodS);
    const next = lastDueSlot(nowMs, periodMs, rt.options.graceFraction * periodMs);
    twin = createLoopTwin(incoming, { next, staleAfterSamples: current.staleAfterSamples });
    reason = 're-initialised at the operating point: the sample period changed, so the slot grid did';
  } else {
    ({ twin, reason } = swapLoopTwin(current, incoming));
  }
  rt.twins.set(twin.loopId, twin);
  rt.lastPersistMs = 0; // this tick saves the state, so the new version shows as running at once
  rt.log(`${incoming.loopTag}: version ${from} → ${incoming.version.number} at slot ${twin.next}; ${reason}`);
  return twin;
}

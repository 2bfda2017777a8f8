/** The socket.io event contract shared by the api, the simulator and the web app (API.md, Realtime). */
export type TrackingStatus = 'in_step' | 'drifting' | 'diverged' | 'stale' | 'no_twin';

export interface TwinSample {
  loopId: string;
  t: string;
  k: number;
  predicted: number[];
  measured: number[] | null;
  residual: number[] | null;
  status: TrackingStatus;
}

export interface ClientToServerEvents {
  'loop:watch': (payload: { loopId: string }) => void;
  'loop:unwatch': (payload: { loopId: string }) => void;
}

export interface ServerToClientEvents {
  'twin:sample': (sample: TwinSample) => void;
}

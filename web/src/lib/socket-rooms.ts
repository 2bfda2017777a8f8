/**
 * Reference counts of socket rooms: the first holder joins, the last one to let go leaves, so two
 * views of the same loop share one subscription and closing one does not starve the other.
 */
export function createRoomCounter(actions: { join: (room: string) => void; leave: (room: string) => void }) {
  const holders = new Map<string, number>();
  return {
    hold(room: string): () => void {
      const count = holders.get(room) ?? 0;
      holders.set(room, count + 1);
      if (count === 0) actions.join(room);
      let released = false;
      return () => {
        if (released) return;
        released = true;
        const left = (holders.get(room) ?? 1) - 1;
        if (left > 0) holders.set(room, left);
        else {
          holders.delete(room);
          actions.leave(room);
        }
      };
    },
    active(): string[] {
      return [...holders.keys()];
    },
    count(room: string): number {
      return holders.get(room) ?? 0;
    },
  };
}

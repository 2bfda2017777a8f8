/**
 * A stand-in for uPlot in the happy-dom tests, which have no canvas: it takes data, sizes and
 * scales and draws nothing. Use as `vi.mock('uplot', () => import('<path>/test/fake-uplot'))`.
 */
export default class FakeUPlot {
  static tzDate(date: Date): Date {
    return date;
  }
  setData() {}
  setSize() {}
  setScale() {}
  batch(run: () => void) {
    run();
  }
  destroy() {}
}

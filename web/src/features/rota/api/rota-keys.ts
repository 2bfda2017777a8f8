/** One hierarchy for the rota's queries, so a shift change refreshes the week and who is on call now. */
export const rotaKeys = {
  all: ['oncall'] as const,
  shifts: (from: string, to: string) => [...rotaKeys.all, 'shifts', from, to] as const,
  now: () => [...rotaKeys.all, 'now'] as const,
  people: () => [...rotaKeys.all, 'people'] as const,
  areaEngineers: () => [...rotaKeys.all, 'area-engineers'] as const,
};

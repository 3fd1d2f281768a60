import { ROSTER_LEAST_MS, rosterBudgetMs } from './roster-fit';

describe('rosterBudgetMs', () => {
  it('gives a roster day its budget per problem gap, at least the least and at most the limit', () => {
    // Invented figures: 13 gaps at 300 ms is 3.9 s; 2 gaps get the least (2 s); 494 gaps the whole 8 s.
    expect(rosterBudgetMs(13, 8_000, 300)).toBe(3_900);
    expect(rosterBudgetMs(2, 8_000, 300)).toBe(ROSTER_LEAST_MS);
    expect(rosterBudgetMs(494, 8_000, 300)).toBe(8_000);
    // A limit below the least still wins (a caller asking for a quick answer gets one).
    expect(rosterBudgetMs(13, 1_000, 300)).toBe(1_000);
    // Without a budget per gap, the limit.
    expect(rosterBudgetMs(13, 8_000, undefined)).toBe(8_000);
  });
});

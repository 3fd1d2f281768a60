// Run only by unhandled-rejections.spec.ts (not a spec: its first test must fail).
describe('a suite with a leak', () => {
  it('leaks a rejection', async () => {
    void Promise.reject(new Error('lost on purpose'));
    await new Promise((resolve) => setImmediate(resolve));
  });

  it('runs after the leak', () => {
    expect(1 + 1).toBe(2);
  });
});

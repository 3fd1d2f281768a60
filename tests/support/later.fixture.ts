// Run only by unhandled-rejections.spec.ts, after late.fixture.ts in the same process (-i, by name).
describe('the file after a leaky cleanup', () => {
  it('still runs', () => {
    expect(true).toBe(true);
  });
});

// Run only by unhandled-rejections.spec.ts: the file's cleanup sets off a rejection a moment
// later, like a query on a database its afterAll destroyed.
describe('a suite whose cleanup leaks', () => {
  afterAll(() => {
    setImmediate(() => void Promise.reject(new Error('after the cleanup')));
  });

  it('passes', () => {
    expect(true).toBe(true);
  });
});

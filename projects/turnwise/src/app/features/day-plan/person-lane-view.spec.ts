import { clashingPlan, rosterPlan } from './testing/example-roster';
import { durationWords, personLaneView, workAccession } from './person-lane-view';
import { scaleFor } from './timeline-scale';

// Invented roster day (testing/example-roster.ts): Aide 1 covers MR 1 and MR 2, 07:00–15:00, break
// 11:40–12:10, 3 minutes' walk between rooms (common practice, no source).
const at = (hhmm: string) => Date.parse(`2027-03-15T${hhmm}:00-05:00`);
/** 07:00–15:00 at 2 px a minute: x = 2 × minutes after 07:00. */
const scale = scaleFor({ startMs: at('07:00'), endMs: at('15:00') }, 'day', 960);

describe('personLaneView', () => {
  it('places each piece of work at its start, as wide as it lasts, with the room and the next exam', () => {
    const plan = rosterPlan();
    const view = personLaneView(plan.people!.people[0]!, plan, scale);
    expect(scale.pxPerMinute).toBe(2);
    expect(view.work.map((w) => [w.room, w.showRoom, w.accession, w.left, w.width])).toEqual([
      ['MR 1', false, '', 0, 18], // 07:00–07:07: 14 px, widened toward the 24 px pointer target as far as the next piece allows
      ['MR 2', false, '', 20, 24], // widened to 24 px: nothing follows soon
      ['MR 2', true, '…21', (9 * 60 + 52 - 420) * 2, 40], // 20 min: the accession's last part
      ['MR 1', true, '…2', (10 * 60 + 15 - 420) * 2, 40],
      ['MR 2', true, '…22', (10 * 60 + 50 - 420) * 2, 40],
      ['MR 2', true, '…23', (12 * 60 + 10 - 420) * 2, 40],
    ]);
    // The words in view first and in order, then the whole accession they cut (WCAG 2.5.3).
    expect(view.work[3]!.label).toBe('MR 1, …2 (ACC-2), turnover 10:15–10:35, short by 6 min');
    expect(view.work[2]!.label).toBe('MR 2, …21 (ACC-21), turnover 09:52–10:12, fits');
    expect(view.work[0]!.label).toBe('MR 1, ACC-1, turnover 07:00–07:07, fits');
    expect(view.work.every((w) => !w.clash && w.row === 0 && w.rows === 1)).toBe(true);
    expect(view.rows).toBe(1);
  });

  it('draws the walk from one room to the next, starting when the work there is done', () => {
    const plan = rosterPlan();
    const view = personLaneView(plan.people!.people[0]!, plan, scale);
    // MR 1 → MR 2 after the opening (07:07), MR 2 → MR 1 at 10:12, MR 1 → MR 2 at 10:35; none within MR 2.
    expect(view.walks.map((w) => [w.left / 2, w.minutes, w.title])).toEqual([
      [7, 3, 'walk MR 1 → MR 2, 3 min'],
      [192, 3, 'walk MR 2 → MR 1, 3 min'],
      [215, 3, 'walk MR 1 → MR 2, 3 min'],
    ]);
  });

  it('shades the hours off shift, draws the break and names free stretches of half an hour or more', () => {
    const plan = rosterPlan();
    const person = { ...plan.people!.people[0]!, start: '2027-03-15T08:00:00-05:00', end: '2027-03-15T14:00:00-05:00' };
    const view = personLaneView(person, plan, scale);
    expect(view.offShift.map((s) => [s.left, s.width])).toEqual([[0, 120], [840, 120]]);
    expect(view.breaks.map((s) => [s.left, s.width, s.text])).toEqual([[(11 * 60 + 40 - 420) * 2, 60, 'break']]);
    // 08:00 → 09:52 (the openings lie before the shift here, so they are not in the way), the half
    // hour before the break, and 12:30 → 14:00; the 5 minutes between 10:38 and ACC-22's turnover are too few to say.
    expect(view.free.map((s) => s.title)).toEqual(['free 08:00–09:52, 1 h 52', 'free 11:10–11:40, 30 min', 'free 12:30–14:00, 1 h 30']);
  });

  it('names the lane with the person, hours, break, turnovers and clashes', () => {
    const plan = rosterPlan();
    expect(personLaneView(plan.people!.people[0]!, plan, scale).label).toBe('Aide 1, 07:00–15:00, break 11:40–12:10, 6 turnovers');
    const clashing = clashingPlan();
    expect(personLaneView(clashing.people!.people[0]!, clashing, scale).label).toBe('Aide 1, 07:00–15:00, break 11:40–12:10, 6 turnovers, 1 clash');
    const named = { ...plan.people!.people[0]!, name: 'Sam Example', label: 'Sam Example', role: 'technologist' as const };
    expect(personLaneView(named, plan, scale).label).toMatch(/^Sam Example, technologist, 07:00–15:00/);
  });

  it('marks two pieces at once as a clash, draws them in two rows and says with what in each label', () => {
    const plan = clashingPlan();
    const view = personLaneView(plan.people!.people[0]!, plan, scale);
    const clashing = view.work.filter((w) => w.clash);
    expect(clashing.map((w) => w.toExamId)).toEqual([2, 22]);
    expect(clashing.map((w) => [w.row, w.rows])).toEqual([[0, 2], [1, 2]]);
    // 20 min at 2 px a minute, the room beside the accession on one line: room for its last part only.
    expect(clashing.map((w) => [w.room, w.accession])).toEqual([['MR 1', ''], ['MR 2', '']]);
    expect(view.rows).toBe(2);
    // Work that clashes with nothing keeps the whole height of the lane.
    expect(view.work.filter((w) => !w.clash).every((w) => w.row === 0 && w.rows === 1)).toBe(true);
    expect(clashing[0]!.label).toBe('MR 1, ACC-2, turnover 10:15–10:35, short by 6 min; clashes with MR 2, ACC-22 (10:25–10:45)');
    expect(view.clashes).toEqual([{ left: (10 * 60 + 25 - 420) * 2, width: 20, text: 'clash 10:25–10:35' }]);
    // No walk is drawn into a piece that has already begun.
    expect(view.walks.some((w) => w.left >= (10 * 60 + 12 - 420) * 2 && w.left < (10 * 60 + 45 - 420) * 2 && w.title.includes('MR 1 → MR 2'))).toBe(false);
  });

  it('marks a move to another room with less time than the walk as a clash', () => {
    const plan = rosterPlan();
    const person = plan.people!.people[0]!;
    // Invented hand edit: MR 1's turnover at 10:13, one minute after MR 2's ends, with 3 to walk.
    const work = person.work.map((w) => (w.toExamId === 2 ? { ...w, start: '2027-03-15T10:13:00-05:00', end: '2027-03-15T10:33:00-05:00' } : w));
    const view = personLaneView({ ...person, work }, plan, scale);
    expect(view.clashes.map((c) => c.text)).toEqual(['no time to walk']);
    expect(view.work.find((w) => w.toExamId === 2)!.label).toContain('no time to walk from MR 2 (2 min short)');
    expect(view.work.find((w) => w.toExamId === 21)!.label).toContain('no time to walk to MR 1 (2 min short)');
  });

  it('dims work on fitting gaps when only problem gaps are asked for', () => {
    const plan = rosterPlan();
    const view = personLaneView(plan.people!.people[0]!, plan, scale, true);
    expect(view.work.filter((w) => !w.dimmed).map((w) => w.toExamId)).toEqual([2, 23]);
  });

  it('shows the whole accession when the block is wide enough, else its end', () => {
    expect([workAccession('ACC-21', 60), workAccession('ACC-21', 40), workAccession('ACC-21', 30)]).toEqual(['ACC-21', '…21', '']);
  });

  it('says durations in minutes, then hours and minutes', () => {
    expect([durationWords(45), durationWords(60), durationWords(65), durationWords(130)]).toEqual(['45 min', '1 h', '1 h 05', '2 h 10']);
  });
});

import { describe, expect, it } from 'vitest';
import type { LimitRow } from '../../server/contracts/periods.js';
import FlagChips from '../../src/components/lab/FlagChips.vue';
import LimitStatus from '../../src/components/periods/LimitStatus.vue';
import { mountWithApp } from './mount';

// The product brief: status is never colour alone; every state also has a word and an icon.
const row = (over: Partial<LimitRow>): LimitRow => ({
  limitId: 'L',
  appliesFrom: '2026-01-01',
  appliesTo: '2026-01-31',
  inputsWithFindings: [],
  grabsOverOnCompliantDays: [],
  dischargePointId: 'P',
  pointCode: 'OF-001',
  parameterId: 'X',
  parameter: 'Oil and grease',
  statistic: 'daily-maximum',
  unit: 'mg/L',
  limitValue: 100,
  computedValue: 40,
  shownValue: '40.0',
  precision: 'EPA Method 1664 Rev. B §12.3',
  exceeded: false,
  daysWithoutFlow: [],
  samplesTaken: 2,
  samplesRequired: 2,
  missedMonitoring: [],
  dailyValues: [],
  monthlyValues: [],
  exceedances: [],
  ...over,
});

describe('status words and icons', () => {
  it.each([
    [{ computedValue: 40 }, 'Within limit'],
    [{ computedValue: 90 }, 'Near limit'],
    [{ computedValue: 120, exceeded: true }, 'Over limit'],
    [{ computedValue: '<ML' as const }, 'Non-detect'],
    [{ computedValue: null }, 'Missing'],
    [{ computedValue: 10, unit: 'lb/day', daysWithoutFlow: ['2026-04-21'] }, 'Flow missing'],
  ])('shows %j as "%s" with an icon', (over, word) => {
    const wrapper = mountWithApp(LimitStatus, { props: { row: row(over) } });
    expect(wrapper.text()).toContain(word);
    expect(wrapper.find('.v-icon').exists()).toBe(true);
    wrapper.unmount();
  });

  it('gives every finding a word and an icon, not only a colour', () => {
    const wrapper = mountWithApp(FlagChips, {
      props: { flags: [{ code: 'holding-time', severity: 'error', message: 'Analysed late', source: 'EPA Method 1664 Rev. B §8.5' }] },
    });
    expect(wrapper.text()).toContain('Holding time');
    expect(wrapper.find('[data-flag="holding-time"] .v-icon').exists()).toBe(true);
    wrapper.unmount();
  });

  it('opens the reason of a finding with a tap, on the page rather than in a hover tooltip', async () => {
    const wrapper = mountWithApp(FlagChips, {
      props: { flags: [{ code: 'holding-time', severity: 'error', message: 'Analysed late', source: 'EPA Method 1664 Rev. B §8.5' }] },
    });
    expect(wrapper.find('[data-test="flag-reason"]').exists()).toBe(false);
    await wrapper.find('[data-flag="holding-time"]').trigger('click');
    expect(wrapper.find('[data-test="flag-reason"]').text()).toBe('Analysed late (rule: EPA Method 1664 Rev. B §8.5)');
    wrapper.unmount();
    const detail = mountWithApp(FlagChips, {
      props: { flags: [{ code: 'holding-time', severity: 'error', message: 'Analysed late', source: 'x' }], showAll: true },
    });
    expect(detail.find('[data-test="flag-reason"]').exists()).toBe(true);
    detail.unmount();
  });

  it('says "No findings" when the only flags are notes it hides, instead of leaving the cell blank', () => {
    const wrapper = mountWithApp(FlagChips, {
      props: {
        flags: [{ code: 'excess-precision', severity: 'info', message: 'Shown as 23.5 mg/L', source: 'EPA Method 1664 Rev. B §12.3' }],
        showClear: true,
        hideInfo: true,
      },
    });
    expect(wrapper.text()).toContain('No findings (notes only)');
    wrapper.unmount();
  });
});

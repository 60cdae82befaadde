import { describe, expect, it } from 'vitest';
import { priorityWeight, priorityWords } from '../../src/features/monitoring/utils/priority';
import { eventLabel, isFalseAlarmOutcome, outcomeLabel } from '../../src/utils/alarm-words';
import { formatDuration, formatElapsedSince, formatTimeAgo } from '../../src/utils/elapsed';

// Wardbook's own words and layout rules for the monitoring screens; no outside source applies.

describe('durations on the queue', () => {
  it('shows seconds under an hour, then hours and minutes, then days', () => {
    expect(formatDuration(0)).toBe('0 s');
    expect(formatDuration(59.9)).toBe('59 s');
    expect(formatDuration(60)).toBe('1 min 00 s');
    expect(formatDuration(185)).toBe('3 min 05 s');
    expect(formatDuration(3600 + 4 * 60 + 59)).toBe('1 h 04 min');
    expect(formatDuration(2 * 86_400 + 3 * 3600)).toBe('2 d 3 h');
    expect(formatDuration(-5)).toBe('0 s');
  });

  it('counts from an ISO time to a given moment, never below zero', () => {
    const now = Date.parse('2026-12-02T10:15:30Z');
    expect(formatElapsedSince('2026-12-02T10:13:00Z', now)).toBe('2 min 30 s');
    expect(formatElapsedSince('2026-12-02T10:16:00Z', now)).toBe('0 s');
    expect(formatElapsedSince('not a time', now)).toBe('');
    expect(formatTimeAgo('2026-12-02T10:15:00Z', now)).toBe('just now');
    expect(formatTimeAgo('2026-12-02T10:03:00Z', now)).toBe('12 minutes ago');
    expect(formatTimeAgo('2026-12-02T09:15:00Z', now)).toBe('1 hour ago');
  });
});

describe('priorities', () => {
  it('gives the heaviest mark to hold-up and fire, and none below faults', () => {
    expect([1, 2, 3, 4, 5, 6, 7].map(priorityWeight)).toEqual([5, 4, 3, 2, 1, 0, 0]);
    expect(priorityWords(1)).toBe('Highest');
    expect(priorityWords(9)).toBe('Priority 9');
  });
});

describe('event and outcome words', () => {
  it('says when an intruder alarm is confirmed, and reads unknown outcomes', () => {
    expect(eventLabel('burglary', true)).toBe('Intruder alarm, confirmed');
    expect(eventLabel('fire', true)).toBe('Fire alarm');
    expect(outcomeLabel('false_alarm_user')).toBe('False alarm: user error');
    expect(outcomeLabel('something_new')).toBe('Something new');
    expect(outcomeLabel(null)).toBe('Not closed');
  });

  it('counts every false-alarm outcome against police response, and nothing else', () => {
    expect(isFalseAlarmOutcome('false_alarm_environment')).toBe(true);
    expect(isFalseAlarmOutcome('genuine')).toBe(false);
    expect(isFalseAlarmOutcome('test_or_engineer')).toBe(false);
    expect(isFalseAlarmOutcome(null)).toBe(false);
  });
});

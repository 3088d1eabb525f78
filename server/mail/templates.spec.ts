import { SAFETY_POINTS } from '@shared/safety';
import { coachingDigestMail, invitationMail, passwordResetMail, weeklySummaryMail } from './templates';

const digest = () =>
  coachingDigestMail({
    to: 'rookie@example.test',
    playerName: 'Rookie',
    points: [{ sessionTitle: 'Week 2 vs Granite Fork', snapOrder: 14, at: '0:03', kind: 'technique', body: 'Hands <inside> & low.', author: 'Coach Vale', link: 'https://tw.example/study/clips/9?at=3000' }],
    queueLink: 'https://tw.example/study',
    unsubscribeLink: 'https://tw.example/mail/unsubscribe?token=x',
  });

const weekly = () =>
  weeklySummaryMail({ to: 'rookie@example.test', playerName: 'Rookie', lines: ['Plus rate, newest first'], link: 'https://tw.example/progress/3', unsubscribeLink: 'https://tw.example/mail/unsubscribe?token=y' });

describe('the safety caution in player mails', () => {
  test.each([
    ['coaching-point digest', digest],
    ['weekly summary', weekly],
  ])('the %s carries every point of the caution in its HTML part, escaped', (_name, mail) => {
    const { html = '', text } = mail();
    for (const point of SAFETY_POINTS) expect(html).toContain(`<li>${point.replace(/'/g, '&#39;')}</li>`);
    expect(html).not.toContain("body's");
    expect(text).toContain('athletic trainer and physicians decide');
  });

  test('the caution sits above the unsubscribe line, inside the mail body', () => {
    const html = digest().html ?? '';
    expect(html.indexOf('athletic trainer')).toBeGreaterThan(html.indexOf('Open your study queue'));
    expect(html.indexOf('athletic trainer')).toBeLessThan(html.indexOf('Stop these mails'));
    expect(html).toContain('Hands &lt;inside&gt; &amp; low.');
  });

  test('account mails (invitation, password reset) stay without it', () => {
    const invite = invitationMail({ to: 'a@example.test', teamName: 'Ironvale Anvils', inviterName: 'Coach Vale', role: 'coach', link: 'https://tw.example/join?t=1', expiresAt: new Date('2026-01-01T00:00:00Z') });
    const reset = passwordResetMail({ to: 'a@example.test', name: 'A', link: 'https://tw.example/reset?t=1', ttlMinutes: 30 });
    for (const m of [invite, reset]) expect(m.html).not.toContain('athletic trainer');
  });
});

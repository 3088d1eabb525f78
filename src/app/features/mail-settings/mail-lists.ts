export type MailList = 'digest' | 'weekly';

export const MAIL_LIST_NAMES: Record<MailList, string> = {
  digest: 'New coaching points',
  weekly: 'Weekly summary',
};

export const MAIL_LIST_DESCRIPTIONS: Record<MailList, string> = {
  digest: 'the mail that collects new coaching points on your clips',
  weekly: 'the Monday mail with your plus rates and goals',
};

/**
 * Which list an unsubscribe link is for. The token is "account.list.signature"; the list is plain
 * text in it, so the page can say what the button does before anything is sent. The server checks
 * the signature; this only reads.
 */
export function listOfToken(token: string | undefined | null): MailList | null {
  const list = token?.split('.')[1];
  return list === 'digest' || list === 'weekly' ? list : null;
}

import type { MyAcknowledgementDto, RecipeVersionDto } from '../../../../shared/recipe-types';

/** The sentence an operator confirms; the same words on the page and in the print dialog. */
export function acknowledgeStatement(number: string, version: number): string {
  return `I have read and understood version ${version} of ${number}.`;
}

/** True while the signed-in operator must still acknowledge this version before its sheet opens. */
export function mustAcknowledge(version: Pick<RecipeVersionDto, 'myAcknowledgement'> | null | undefined): boolean {
  const mine: MyAcknowledgementDto | null | undefined = version?.myAcknowledgement;
  return !!mine && mine.required && !mine.acknowledgedAt;
}

/**
 * Opens a bench sheet in a new tab, as the sheet links do. Returns false when the browser
 * blocked the tab (it may, when the tab opens after a request rather than straight from a
 * click), so the caller can offer a plain link instead.
 */
export function openInNewTab(url: string): boolean {
  const tab = window.open(url, '_blank');
  if (!tab) return false;
  // Same as rel="noopener" on the links: the sheet's tab gets no handle on this one.
  tab.opener = null;
  return true;
}

/**
 * The bench sheet PDF of an approved version, printed at the saw. Opened as a plain link in a
 * new tab: the browser sends the session cookie and shows or saves the PDF; the server records
 * every print.
 */
export function benchSheetUrl(recipeId: number, version: number): string {
  return `/api/recipes/${recipeId}/versions/${version}/sheet.pdf`;
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

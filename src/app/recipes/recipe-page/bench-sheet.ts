/**
 * The bench sheet PDF of an approved version (design section 8). Opened as a plain link in a
 * new tab: the browser sends the session cookie and shows or saves the PDF; the server records
 * every print.
 */
export function benchSheetUrl(recipeId: number, version: number): string {
  return `/api/recipes/${recipeId}/versions/${version}/sheet.pdf`;
}

import type { MyAcknowledgementDto, RecipeVersionDto } from '@shared/recipe-types';

/** The sentence an operator confirms; the same words on the page and in the print dialog. */
export function acknowledgeStatement(number: string, version: number): string {
  return `I have read and understood version ${version} of ${number}.`;
}

/** True while the signed-in operator must still acknowledge this version before its sheet opens. */
export function mustAcknowledge(version: Pick<RecipeVersionDto, 'myAcknowledgement'> | null | undefined): boolean {
  const mine: MyAcknowledgementDto | null | undefined = version?.myAcknowledgement;
  return !!mine && mine.required && !mine.acknowledgedAt;
}

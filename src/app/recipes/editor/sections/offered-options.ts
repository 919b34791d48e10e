/**
 * The choices of a list the chosen machine narrows (cut motions, clamping methods): those it
 * offers, plus a stored value it lacks, marked, so that value is not lost.
 */
export function offeredOptions<T extends string>(
  all: readonly T[],
  offered: readonly T[] | undefined,
  current: T | null,
  labels: Record<T, string>,
): { value: T; label: string; offered: boolean }[] {
  const available = offered ?? all;
  return all
    .filter((value) => available.includes(value) || value === current)
    .map((value) => ({ value, label: labels[value], offered: available.includes(value) }));
}

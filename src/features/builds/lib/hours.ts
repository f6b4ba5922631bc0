// A fixed locale so the server's HTML and the hydrating browser print the same figures.
const hoursFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });

/** Hours worked for reading: 12.5 → "12.5 h", 1 → "1 h". */
export function formatHours(hours: number): string {
  return `${hoursFormat.format(hours)} h`;
}

/** Inches with eighths as fractions where exact (1.375 → 1⅜), else up to three decimals. */
export function fmtIn(value: number): string {
  const eighths = Math.round(value * 8);
  if (Math.abs(eighths / 8 - value) < 1e-6) {
    const whole = Math.floor(eighths / 8);
    const rest = eighths % 8;
    const frac = ['', '⅛', '¼', '⅜', '½', '⅝', '¾', '⅞'][rest];
    return whole === 0 && rest ? frac : `${whole}${frac}`;
  }
  return String(Math.round(value * 1000) / 1000);
}

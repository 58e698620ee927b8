import { z } from "zod";

/**
 * The one definition of a calendar date that Benchfold accepts, wherever a date arrives: the
 * upload form, the bench API, a bench file's `# date:` line, instrument calibration dates.
 * ISO 8601 calendar date in the extended format (YYYY-MM-DD), proleptic Gregorian calendar.
 */

export const earliestYear = 1900;
export const latestYear = 9999;

const monthNames = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"] as const;

/** Gregorian rule: every fourth year, except centuries not divisible by 400 (ISO 8601-1:2019, 3.2.1 and 4.3.2). */
export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/** Why `text` is not a calendar date as YYYY-MM-DD, or undefined when it is one. */
export function calendarDateProblem(text: string): string | undefined {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!match) {
    const shown = text.length > 40 ? `${text.slice(0, 40)}…` : text;
    return `"${shown}" is not a date as YYYY-MM-DD (e.g. 2026-03-31)`;
  }
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  if (year < earliestYear || year > latestYear) return `${text} is not a date: the year must be from ${earliestYear} to ${latestYear}`;
  if (month < 1 || month > 12) return `${text} is not a date: there is no month ${match[2]}`;
  const days = daysInMonth(year, month);
  if (day < 1 || day > days) return `${text} is not a date: ${monthNames[month - 1]} ${year} has ${days} days`;
  return undefined;
}

export function isCalendarDate(text: string): boolean {
  return calendarDateProblem(text) === undefined;
}

/** A required calendar date (surrounding whitespace ignored). */
export const calendarDateSchema = z
  .string()
  .trim()
  .superRefine((value, ctx) => {
    const problem = calendarDateProblem(value);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });

/** A calendar date that may be left blank: a blank or absent field is undefined. */
export const optionalCalendarDateSchema = z.preprocess(
  (value) => (value === null || (typeof value === "string" && value.trim() === "") ? undefined : value),
  calendarDateSchema.optional(),
);

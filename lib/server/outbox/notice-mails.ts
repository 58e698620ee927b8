import "server-only";

/**
 * The words of the review and release notices, for enqueueNotices: one builder per event, each
 * giving the subject and plain text (recipients and the event key are the caller's). The link
 * leads to the page where the recipient acts; the notices carry no sheet content beyond the
 * part number and title, since a mailbox is not as private as the workspace.
 */
export type NoticeWords = { subject: string; text: string };

type SheetRef = { partNumber: string; title: string; organizationName: string; link: string };

const footer = ["", "—", "Benchfold sends this notice once; you receive it because of your role in the organization."];

export function candidateSubmittedWords(opts: SheetRef & { submitterName: string }): NoticeWords {
  return {
    subject: `${opts.partNumber} submitted for review`,
    text: [
      `${opts.submitterName} submitted the datasheet of ${opts.partNumber} (${opts.title}) for review in ${opts.organizationName}.`,
      "",
      `Review it: ${opts.link}`,
      ...footer,
    ].join("\n"),
  };
}

export function changesRequestedWords(opts: SheetRef & { reviewerName: string; reason: string }): NoticeWords {
  return {
    subject: `Changes requested on ${opts.partNumber}`,
    text: [
      `${opts.reviewerName} asked for changes to the datasheet of ${opts.partNumber} (${opts.title}):`,
      "",
      ...opts.reason.split(/\r?\n/).map((line) => `  ${line}`),
      "",
      `Open the sheet: ${opts.link}`,
      ...footer,
    ].join("\n"),
  };
}

export function candidateApprovedWords(opts: SheetRef & { reviewerName: string }): NoticeWords {
  return {
    subject: `${opts.partNumber} approved for release`,
    text: [
      `${opts.reviewerName} signed the datasheet of ${opts.partNumber} (${opts.title}) as reviewed and approved for release.`,
      "",
      `Release it: ${opts.link}`,
      ...footer,
    ].join("\n"),
  };
}

/** The review starts over: the data, limits or prose changed after submission. Sent to author and reviewers. */
export function candidateStaleWords(opts: SheetRef & { why: string }): NoticeWords {
  return {
    subject: `Review of ${opts.partNumber} starts over`,
    text: [
      `The datasheet of ${opts.partNumber} (${opts.title}) changed after it was submitted, so its review starts over: ${opts.why}`,
      "",
      `Open the sheet: ${opts.link}`,
      ...footer,
    ].join("\n"),
  };
}

export function revisionReleasedWords(opts: SheetRef & { revisionLetter: string; releasedOn: string }): NoticeWords {
  return {
    subject: `${opts.partNumber} revision ${opts.revisionLetter} released`,
    text: [
      `${opts.organizationName} released revision ${opts.revisionLetter} of the datasheet of ${opts.partNumber} (${opts.title}) on ${opts.releasedOn}.`,
      "",
      `Read it and download the PDF: ${opts.link}`,
      "",
      "—",
      "You receive this because you follow this part on Benchfold.",
    ].join("\n"),
  };
}

/**
 * A conformity alert: a unit approved after the release falls outside a guaranteed limit, or a
 * control-chart test signalled. Names the parameters and the tests, never the measured values.
 */
export function conformityAlertWords(opts: SheetRef & { revisionLetter: string; serial: string; setId: number; outside: string[]; tests: string[] }): NoticeWords {
  const lines = [
    ...opts.outside.map((p) => `- ${p}: outside its guaranteed limit`),
    ...opts.tests.map((t) => `- ${t}`),
  ];
  return {
    subject: `Conformity alert on ${opts.partNumber} Rev. ${opts.revisionLetter}`,
    text: [
      `Unit ${opts.serial} (measurement set #${opts.setId}) of ${opts.partNumber} (${opts.title}), approved after revision ${opts.revisionLetter} was released, does not agree with that revision in ${opts.organizationName}:`,
      "",
      ...lines,
      "",
      "The alert stays open until an engineer closes it with a reason.",
      `Open the device: ${opts.link}`,
      ...footer,
    ].join("\n"),
  };
}

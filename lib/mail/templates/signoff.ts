// The sign-off e-mails: approvers hear that a draft waits for them; its author hears that it was
// approved or returned, and why. Pure: built from the facts of one edition.
import { quotedLabName } from "../templates";
import { formatDate } from "@/lib/format/dates";

export type SignoffFacts = {
  labName: string;
  labSlug: string;
  timeZone: string;
  chartId: number;
  chartTitle: string;
  editionId: number;
  editionNumber: number;
  authorName: string | null;
};

const CLOSING = "Reference aid only; local protocol and licensed practice rule.";
const chartUrl = (f: SignoffFacts, appUrl: string) => `${appUrl}/labs/${f.labSlug}/charts/${f.chartId}`;
const reviewUrl = (f: SignoffFacts, appUrl: string) => `${appUrl}/labs/${f.labSlug}/sign-off/${f.editionId}`;
const what = (f: SignoffFacts) => `Edition ${f.editionNumber} of "${f.chartTitle}"`;

export function waitingForSignoffMail(f: SignoffFacts, appUrl: string): { subject: string; text: string } {
  return {
    subject: `Forkwall: ${what(f)} is waiting for sign-off in ${quotedLabName(f.labName)}`,
    text: [
      `${what(f)} was submitted${f.authorName ? ` by ${f.authorName}` : ""} and is waiting for sign-off in ${quotedLabName(f.labName)}.`,
      "",
      `Review what it prints and what changed, then approve or return it: ${reviewUrl(f, appUrl)}`,
      "",
      "Nothing is printed for the wall until it is approved. " + CLOSING,
    ].join("\n"),
  };
}

export function approvedMail(
  f: SignoffFacts & { approverName: string; reviewBy: Date },
  appUrl: string,
): { subject: string; text: string } {
  return {
    subject: `Forkwall: ${what(f)} was approved`,
    text: [
      `${what(f)} was approved by ${f.approverName} in ${quotedLabName(f.labName)}.`,
      `It is due for review by ${formatDate(f.reviewBy, f.timeZone)}.`,
      `What was approved: ${reviewUrl(f, appUrl)}`,
      "",
      `Print it and record where it hangs: ${chartUrl(f, appUrl)}`,
      "",
      CLOSING,
    ].join("\n"),
  };
}

export function returnedMail(
  f: SignoffFacts & { returnerName: string; reason: string },
  appUrl: string,
): { subject: string; text: string } {
  return {
    subject: `Forkwall: ${what(f)} was returned`,
    text: [
      `${what(f)} was returned by ${f.returnerName} in ${quotedLabName(f.labName)}; it will not be approved.`,
      `Reason: ${f.reason}`,
      "",
      `Change the chart and submit a new edition: ${chartUrl(f, appUrl)}`,
      "",
      CLOSING,
    ].join("\n"),
  };
}

// Turns an outbox row into a message: subject, HTML and plain text, rendered with React Email.
import { render } from "@react-email/render";
import { createElement, type ReactElement } from "react";
import { publicUrl } from "./config";
import { GradeMail, gradeSubject, type GradeMailData } from "./templates/grade-mail";
import { PasswordMail, passwordSubject, type PasswordMailData } from "./templates/password-mail";

export interface RenderedMail {
  subject: string;
  html: string;
  text: string;
}

const GRADE_KINDS = new Set(["graded", "recomputed", "override", "rerun", "review_answer", "released"]);

function element(kind: string, data: unknown): { subject: string; el: ReactElement } {
  const base = publicUrl();
  if (GRADE_KINDS.has(kind)) {
    const d = data as GradeMailData;
    return { subject: gradeSubject(d), el: createElement(GradeMail, { data: d, url: base + d.attemptPath }) };
  }
  if (kind === "password_reset" || kind === "password_set") {
    const d = data as PasswordMailData;
    return { subject: passwordSubject(d), el: createElement(PasswordMail, { data: d, url: base + d.tokenPath }) };
  }
  throw new Error(`no template for mail kind "${kind}"`);
}

export async function renderMail(kind: string, data: unknown, subject?: string | null): Promise<RenderedMail> {
  const { subject: s, el } = element(kind, data);
  const [html, text] = await Promise.all([render(el), render(el, { plainText: true })]);
  return { subject: subject ?? s, html, text };
}

// A student's lab handout: instructions, safety notes, the circuit, the student's own values, the
// questions with their units and points, and the rules. A server component (no client JavaScript):
// symbols are typeset by KaTeX on the server, the instructor's Markdown by the small renderer below,
// which builds React elements and never injects the typed text as HTML. Prints on one or two pages.
import katex from "katex";
import { Fragment, type ReactNode } from "react";
import type { handoutFromParams } from "@/lib/labs/handout";
import { CircuitDiagram } from "@/components/lesson/diagrams";
import { Caution } from "@/components/lesson/Caution";

export type HandoutData = ReturnType<typeof handoutFromParams>;

export interface HandoutProps {
  handout: HandoutData;
  /** a heading level offset is not needed; `headingLevel` 1 makes the title the page's h1 */
  headingLevel?: 1 | 2;
  /** time zone for the dates (default: the server's) */
  timeZone?: string;
}

// ---------------------------------------------------------------------------------------------------
// Markdown, simply: paragraphs, headings, bullet and numbered lists, code blocks, **bold**, *italic*, `code`.

const INLINE = /(`[^`\n]+`)|(\*\*[^\n]+?\*\*)|(__[^\n]+?__)|(\*[^*\s\n](?:[^*\n]*[^*\s\n])?\*)|(\b_[^_\s\n](?:[^_\n]*[^_\s\n])?_\b)/;

export function renderInline(text: string, keyPrefix = "i"): ReactNode[] {
  const out: ReactNode[] = [];
  let rest = text;
  let k = 0;
  while (rest.length > 0) {
    const m = INLINE.exec(rest);
    if (!m) {
      out.push(rest);
      break;
    }
    if (m.index > 0) out.push(rest.slice(0, m.index));
    const token = m[0];
    const key = `${keyPrefix}-${k++}`;
    if (m[1]) out.push(<code key={key} className="rounded bg-paper-sunk px-1 font-mono text-[0.9em]">{token.slice(1, -1)}</code>);
    else if (m[2] || m[3]) out.push(<strong key={key}>{renderInline(token.slice(2, -2), key)}</strong>);
    else out.push(<em key={key}>{renderInline(token.slice(1, -1), key)}</em>);
    rest = rest.slice(m.index + token.length);
  }
  return out;
}

type Block =
  | { kind: "p"; lines: string[] }
  | { kind: "h"; level: number; text: string }
  | { kind: "ul" | "ol"; items: string[] }
  | { kind: "code"; text: string };

export function parseMarkdown(source: string): Block[] {
  const lines = source.replace(/\r\n?/g, "\n").split("\n");
  const blocks: Block[] = [];
  let i = 0;
  while (i < lines.length) {
    const line = lines[i];
    if (/^\s*```/.test(line)) {
      const body: string[] = [];
      i++;
      while (i < lines.length && !/^\s*```/.test(lines[i])) body.push(lines[i++]);
      i++; // closing fence (or end)
      blocks.push({ kind: "code", text: body.join("\n") });
      continue;
    }
    if (line.trim() === "") {
      i++;
      continue;
    }
    const h = /^(#{1,6})\s+(.*)$/.exec(line);
    if (h) {
      blocks.push({ kind: "h", level: h[1].length, text: h[2].replace(/\s+#+\s*$/, "") });
      i++;
      continue;
    }
    const bullet = /^\s*[-*+]\s+(.*)$/;
    const numbered = /^\s*\d+[.)]\s+(.*)$/;
    const kind = bullet.test(line) ? "ul" : numbered.test(line) ? "ol" : null;
    if (kind) {
      const re = kind === "ul" ? bullet : numbered;
      const items: string[] = [];
      while (i < lines.length && lines[i].trim() !== "") {
        const m = re.exec(lines[i]);
        if (m) items.push(m[1]);
        else if (/^\s+\S/.test(lines[i]) && items.length) items[items.length - 1] += ` ${lines[i].trim()}`;
        else break;
        i++;
      }
      blocks.push({ kind, items });
      continue;
    }
    const para: string[] = [];
    while (i < lines.length && lines[i].trim() !== "" && !/^\s*```/.test(lines[i]) && !/^#{1,6}\s/.test(lines[i]) && !bullet.test(lines[i]) && !numbered.test(lines[i])) {
      para.push(lines[i].trim());
      i++;
    }
    if (para.length) blocks.push({ kind: "p", lines: para });
    else i++;
  }
  return blocks;
}

/** The instructor's Markdown as React elements; headings start at `baseLevel` (h3 by default). */
export function Markdown({ source, baseLevel = 3 }: { source: string; baseLevel?: number }) {
  const blocks = parseMarkdown(source);
  return (
    <>
      {blocks.map((b, n) => {
        const key = `b${n}`;
        switch (b.kind) {
          case "h": {
            const level = Math.min(6, baseLevel + b.level - 1);
            const Tag = `h${level}` as "h3";
            return (
              <Tag key={key} className="mt-4 mb-1 text-base font-semibold">
                {renderInline(b.text, key)}
              </Tag>
            );
          }
          case "ul":
            return (
              <ul key={key} className="my-2 list-disc pl-6">
                {b.items.map((it, j) => (
                  <li key={j}>{renderInline(it, `${key}-${j}`)}</li>
                ))}
              </ul>
            );
          case "ol":
            return (
              <ol key={key} className="my-2 list-decimal pl-6">
                {b.items.map((it, j) => (
                  <li key={j}>{renderInline(it, `${key}-${j}`)}</li>
                ))}
              </ol>
            );
          case "code":
            return (
              <pre key={key} className="my-2 overflow-x-auto rounded-md bg-paper-sunk p-3 font-mono text-sm">
                <code>{b.text}</code>
              </pre>
            );
          default:
            return (
              <p key={key} className="my-2">
                {b.lines.map((l, j) => (
                  <Fragment key={j}>
                    {j > 0 ? " " : null}
                    {renderInline(l, `${key}-${j}`)}
                  </Fragment>
                ))}
              </p>
            );
        }
      })}
    </>
  );
}

// ---------------------------------------------------------------------------------------------------

/** A template's LaTeX symbol, typeset on the server (template data, never user input). */
function Tex({ tex }: { tex: string }) {
  if (!tex) return null;
  const html = katex.renderToString(tex, { throwOnError: false, output: "html", strict: false });
  return <span dangerouslySetInnerHTML={{ __html: html }} />;
}

function formatDate(d: Date | string | null | undefined, timeZone?: string): string | null {
  if (!d) return null;
  const date = d instanceof Date ? d : new Date(d);
  if (Number.isNaN(date.getTime())) return null;
  return new Intl.DateTimeFormat("en-GB", { weekday: "long", day: "numeric", month: "long", year: "numeric", hour: "2-digit", minute: "2-digit", timeZone, timeZoneName: "short" }).format(date);
}

const SHOW_EXPECTED: Record<string, string> = {
  after_attempt: "after each attempt",
  after_due: "after the due date",
  never: "not shown; you see your verdicts and feedback",
};

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function Handout({ handout, headingLevel = 1, timeZone }: HandoutProps) {
  const { lab, template, parameters, questions } = handout;
  const Title = headingLevel === 1 ? "h1" : "h2";
  const Section = headingLevel === 1 ? "h2" : "h3";
  const opens = formatDate(lab.opensAt, timeZone);
  const due = formatDate(lab.dueAt, timeZone);
  const totalPoints = questions.reduce((s, q) => s + q.points, 0);
  const idBase = `handout-${lab.id}`;
  return (
    <article className="handout text-ink print:text-[10.5pt] print:leading-snug" aria-labelledby={`${idBase}-title`} data-testid="handout">
      <header>
        <p className="text-xs font-semibold uppercase tracking-wide text-copper">Bench lab · {template.title}</p>
        <Title id={`${idBase}-title`} className="mt-1 text-3xl print:text-2xl">
          {lab.title}
        </Title>
        <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2 print:grid-cols-2">
          <div>
            <dt className="inline font-medium">Opens: </dt>
            <dd className="inline">{opens ?? "open now"}</dd>
          </div>
          <div>
            <dt className="inline font-medium">Due: </dt>
            <dd className="inline">{due ?? "no due date"}</dd>
          </div>
          <div>
            <dt className="inline font-medium">Attempts: </dt>
            <dd className="inline">
              {plural(lab.attemptsAllowed, "attempt")}; the {lab.counting === "best" ? "best" : "last"} one counts
            </dd>
          </div>
          <div>
            <dt className="inline font-medium">Late work: </dt>
            <dd className="inline">
              {lab.latePenaltyPercentPerDay > 0
                ? `${lab.latePenaltyPercentPerDay} % off per day (or part of a day) late, keeping at least ${lab.lateFloorPercent} % of the score`
                : "no penalty"}
            </dd>
          </div>
          <div className="sm:col-span-2 print:col-span-2">
            <dt className="inline font-medium">Expected values: </dt>
            <dd className="inline">{SHOW_EXPECTED[lab.showExpected] ?? lab.showExpected}</dd>
          </div>
        </dl>
      </header>

      {lab.safetyNotes.trim() ? (
        <Caution title="before you build">
          <Markdown source={lab.safetyNotes} baseLevel={4} />
        </Caution>
      ) : (
        <Caution title="before you build">
          <p>Build and change the circuit with the supply off, and check the meter&apos;s range before you connect it.</p>
        </Caution>
      )}

      {lab.instructions.trim() ? (
        <section aria-labelledby={`${idBase}-instructions`} className="mt-4">
          <Section id={`${idBase}-instructions`} className="text-xl print:text-lg">
            Instructions
          </Section>
          <div className="max-w-prose">
            <Markdown source={lab.instructions} baseLevel={headingLevel === 1 ? 3 : 4} />
          </div>
        </section>
      ) : null}

      <div className="mt-4 grid gap-6 md:grid-cols-2 print:grid-cols-2 print:gap-4">
        <section aria-labelledby={`${idBase}-circuit`} className="break-inside-avoid">
          <Section id={`${idBase}-circuit`} className="text-xl print:text-lg">
            The circuit
          </Section>
          <CircuitDiagram template={template.key} idPrefix={idBase} className="print:my-2" />
        </section>
        <section aria-labelledby={`${idBase}-values`} className="break-inside-avoid">
          <Section id={`${idBase}-values`} className="text-xl print:text-lg">
            Your circuit values
          </Section>
          <p className="text-sm text-ink-soft">These values are yours alone; other students have different ones.</p>
          <table className="mt-2 w-full text-sm" data-testid="handout-values">
            <caption className="sr-only">Your circuit values</caption>
            <thead className="bg-paper-sunk text-left">
              <tr>
                <th scope="col" className="px-2 py-1">Quantity</th>
                <th scope="col" className="px-2 py-1">Symbol</th>
                <th scope="col" className="px-2 py-1">Value</th>
                <th scope="col" className="px-2 py-1">Tolerance</th>
              </tr>
            </thead>
            <tbody>
              {parameters.map((p) => (
                <tr key={p.key} className="border-t border-ink/10" data-param={p.key}>
                  <th scope="row" className="px-2 py-1 text-left font-normal">{p.label}</th>
                  <td className="px-2 py-1"><Tex tex={p.symbol} /></td>
                  <td className="px-2 py-1 font-mono whitespace-nowrap" data-testid={`value-${p.key}`}>{p.shown}</td>
                  <td className="px-2 py-1">
                    {p.tolerancePercent !== undefined ? `± ${p.tolerancePercent} %` : "—"}
                    {p.series ? ` (${p.series} series)` : ""}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      </div>

      <section aria-labelledby={`${idBase}-questions`} className="mt-4 break-inside-avoid">
        <Section id={`${idBase}-questions`} className="text-xl print:text-lg">
          Questions ({plural(totalPoints, "point")})
        </Section>
        <ol className="mt-2 grid gap-2">
          {questions.map((q, n) => (
            <li key={q.id} className="rounded-md border border-ink/10 p-3 print:p-2" data-question={q.id}>
              <p className="font-medium">
                {n + 1}. {q.label} <Tex tex={q.symbol} />{" "}
                <span className="text-sm font-normal text-ink-soft">
                  · {q.kind === "bench" ? "bench reading" : "prediction"} · {plural(q.points, "point")}
                </span>
              </p>
              <p className="text-sm text-ink-soft">{q.description}</p>
              <p className="text-sm">
                {q.answerKind === "category"
                  ? `Answer with one of: ${(q.choices ?? []).join(", ")}.`
                  : q.unit
                    ? `Answer with a unit, for example in ${q.displayUnit || q.unit}.`
                    : "Answer with a plain number."}
              </p>
            </li>
          ))}
        </ol>
      </section>
      <p className="no-print mt-4 text-xs text-ink-faint">This handout prints on one or two pages; use your browser&apos;s print command.</p>
    </article>
  );
}

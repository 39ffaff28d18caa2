// A student's lab handout: instructions, safety notes, the circuit, the student's own values, the
// questions with their units and points, and the rules. A server component (no client JavaScript):
// symbols are typeset by KaTeX on the server, the instructor's Markdown by react-markdown (React elements,
// typed HTML kept as text). Prints on one or two pages.
import katex from "katex";
import ReactMarkdown, { type Components } from "react-markdown";
import type { handoutFromParams } from "@/lib/labs/handout";
import { CircuitDiagram } from "@/components/lesson/diagrams";
import { DataTable, type Column } from "@/components/ui/table";
import { Caution } from "@/components/lesson/caution";
import { expectedWhenText } from "@/lib/labs/policy";

export type HandoutData = ReturnType<typeof handoutFromParams>;

const valueColumns: Column<HandoutData["parameters"][number]>[] = [
  { header: "Quantity", rowHeader: true, cell: (p) => p.label },
  { header: "Symbol", cell: (p) => <Tex tex={p.symbol} /> },
  { header: "Value", className: "font-mono whitespace-nowrap", cellProps: (p) => ({ "data-testid": `value-${p.key}` }), cell: (p) => p.shown },
  {
    header: "Tolerance",
    cell: (p) => (
      <>
        {p.tolerancePercent !== undefined ? `± ${p.tolerancePercent} %` : "—"}
        {p.series ? ` (${p.series} series)` : ""}
      </>
    ),
  },
];

export interface HandoutProps {
  handout: HandoutData;
  /** a heading level offset is not needed; `headingLevel` 1 makes the title the page's h1 */
  headingLevel?: 1 | 2;
  /** time zone for the dates (default: the server's) */
  timeZone?: string;
}

// ---------------------------------------------------------------------------------------------------
// The instructor's Markdown, through react-markdown: paragraphs, headings, bullet and numbered lists, code
// blocks, **bold**, *italic* and `code`. Anything else (links, images, quotes) is reduced to its text, and
// typed HTML stays text: react-markdown builds React elements and never injects markup.

const ALLOWED = ["p", "h1", "h2", "h3", "h4", "h5", "h6", "ul", "ol", "li", "pre", "code", "strong", "em"];
const INLINE_CODE = "rounded bg-paper-sunk px-1 font-mono text-[0.9em]";

function codeText(node: { children?: unknown[] } | undefined): string {
  const code = node?.children?.[0] as { children?: { value?: string }[] } | undefined;
  return (code?.children ?? []).map((c) => c.value ?? "").join("").replace(/\n$/, "");
}

function headings(baseLevel: number): Components {
  const out: Components = {};
  for (let level = 1; level <= 6; level++) {
    const Tag = `h${Math.min(6, baseLevel + level - 1)}` as "h3";
    out[`h${level}` as "h1"] = ({ children }) => <Tag className="mt-4 mb-1 text-base font-semibold">{children}</Tag>;
  }
  return out;
}

/** The instructor's Markdown as React elements; headings start at `baseLevel` (h3 by default). */
export function Markdown({ source, baseLevel = 3 }: { source: string; baseLevel?: number }) {
  const components: Components = {
    ...headings(baseLevel),
    p: ({ children }) => <p className="my-2">{children}</p>,
    ul: ({ children }) => <ul className="my-2 list-disc pl-6">{children}</ul>,
    ol: ({ children }) => <ol className="my-2 list-decimal pl-6">{children}</ol>,
    li: ({ children }) => <li>{children}</li>,
    // A code block is drawn here whole; `code` below is then only ever inline code.
    pre: ({ node }) => (
      <pre className="my-2 overflow-x-auto rounded-md bg-paper-sunk p-3 font-mono text-sm">
        <code>{codeText(node)}</code>
      </pre>
    ),
    code: ({ children }) => <code className={INLINE_CODE}>{children}</code>,
  };
  return (
    <ReactMarkdown allowedElements={ALLOWED} unwrapDisallowed components={components}>
      {source}
    </ReactMarkdown>
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

function asDate(d: Date | string | null | undefined): Date | null {
  if (!d) return null;
  const date = d instanceof Date ? d : new Date(d);
  return Number.isNaN(date.getTime()) ? null : date;
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function Handout({ handout, headingLevel = 1, timeZone }: HandoutProps) {
  const { lab, template, parameters, questions } = handout;
  const Title = headingLevel === 1 ? "h1" : "h2";
  const Section = headingLevel === 1 ? "h2" : "h3";
  const opens = formatDate(lab.opensAt, timeZone);
  const due = formatDate(lab.dueAt, timeZone);
  // labPublic gives the effective close (the explicit one or the default)
  const closes = formatDate(lab.closesAt, timeZone);
  const expectedWhen = expectedWhenText(
    { ...lab, dueAt: asDate(lab.dueAt), closesAt: asDate(lab.closesAt) },
    (d) => formatDate(d, timeZone) ?? "",
  );
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
          <div className="sm:col-span-2 print:col-span-2" data-testid="handout-closes">
            <dt className="inline font-medium">Closes: </dt>
            <dd className="inline">
              {closes
                ? lab.dueAt && asDate(lab.closesAt)!.getTime() > asDate(lab.dueAt)!.getTime()
                  ? `${closes}; late attempts are accepted until then, none after`
                  : `${closes}; no attempt is accepted after it`
                : "no close date: attempts are accepted while you have attempts left"}
            </dd>
          </div>
          <div className="sm:col-span-2 print:col-span-2">
            <dt className="inline font-medium">Expected values: </dt>
            <dd className="inline">{expectedWhen}</dd>
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
          <DataTable
            caption="Your circuit values"
            className="mt-2 w-full text-sm"
            testId="handout-values"
            density="snug"
            columns={valueColumns}
            rows={parameters}
            rowKey={(p) => p.key}
            rowProps={(p) => ({ "data-param": p.key })}
          />
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

// The grade message: course, lab, counted score out of the maximum, a line per question with its
// verdict, what changed and why for a regrade, and a link to the attempt page. Expected values are
// never in a message (the attempt page applies the lab's rule for showing them).
import { Body, Button, Container, Head, Heading, Hr, Html, Preview, Section, Text } from "@react-email/components";
import { styles } from "./styles";

export type GradeMailKind = "graded" | "recomputed" | "override" | "rerun" | "review_answer" | "released";

export interface GradeMailData {
  kind: GradeMailKind;
  studentName: string;
  courseCode: string;
  courseTitle: string;
  labTitle: string;
  attemptNumber: number;
  score: number;
  maxScore: number;
  penaltyPercent: number;
  questions: { label: string; verdict: string; points: number; maxPoints: number }[];
  change?: { scoreBefore: number; scoreAfter: number; reason: string | null; by: string | null };
  /** the review answer's text, for kind review_answer */
  answer?: string | null;
  attemptPath: string;
}

const VERDICTS: Record<string, string> = {
  correct: "correct",
  close: "close (partial credit)",
  mistake: "recognised mistake",
  unit: "wrong kind of unit",
  wrong: "not accepted",
  missing: "no answer",
};

export const verdictText = (v: string) => VERDICTS[v] ?? v;

const fmt = (n: number) => String(Math.round(n * 100) / 100);

export function gradeHeadline(d: Pick<GradeMailData, "kind" | "labTitle" | "attemptNumber">): string {
  switch (d.kind) {
    case "graded":
      return `Attempt ${d.attemptNumber} at ${d.labTitle} is graded`;
    case "released":
      return `Your grade for ${d.labTitle} is released`;
    case "recomputed":
      return `Attempt ${d.attemptNumber} at ${d.labTitle} was regraded after a change to the lab`;
    case "review_answer":
      return `The staff answered your review request on ${d.labTitle}`;
    default:
      return `Attempt ${d.attemptNumber} at ${d.labTitle} was regraded by the staff`;
  }
}

export function gradeSubject(d: GradeMailData): string {
  return `${d.courseCode}: ${gradeHeadline(d)} (${fmt(d.score)} / ${fmt(d.maxScore)})`;
}

export function GradeMail({ data, url }: { data: GradeMailData; url: string }) {
  const headline = gradeHeadline(data);
  return (
    <Html lang="en">
      <Head />
      <Preview>{`${headline}: ${fmt(data.score)} of ${fmt(data.maxScore)} points`}</Preview>
      <Body style={styles.body}>
        <Container style={styles.container}>
          <Text style={styles.small}>
            {data.courseCode} · {data.courseTitle}
          </Text>
          <Heading as="h1" style={styles.h1}>
            {headline}
          </Heading>
          <Text style={styles.text}>Hello {data.studentName},</Text>
          <Text style={styles.score}>
            {data.kind === "released" ? "Counted score" : "Score"}: {fmt(data.score)} / {fmt(data.maxScore)} points
            {data.penaltyPercent > 0 ? ` (after a late penalty of ${fmt(data.penaltyPercent)} %)` : ""}
          </Text>
          {data.change ? (
            <Section style={styles.box}>
              <Text style={styles.text}>
                What changed: {fmt(data.change.scoreBefore)} → {fmt(data.change.scoreAfter)} points
                {data.change.by ? `, by ${data.change.by}` : ""}.
              </Text>
              {data.change.reason ? <Text style={styles.text}>Reason: {data.change.reason}</Text> : null}
            </Section>
          ) : null}
          {data.answer ? (
            <Section style={styles.box}>
              <Text style={styles.text}>Answer from the staff: {data.answer}</Text>
            </Section>
          ) : null}
          <Heading as="h2" style={styles.h2}>
            Question by question
          </Heading>
          {data.questions.map((q, i) => (
            <Text key={i} style={styles.line}>
              {i + 1}. {q.label}: {verdictText(q.verdict)}, {fmt(q.points)} / {fmt(q.maxPoints)}
            </Text>
          ))}
          <Section style={styles.actions}>
            <Button href={url} style={styles.button}>
              Open the attempt
            </Button>
          </Section>
          <Text style={styles.small}>Or paste this address into your browser: {url}</Text>
          <Hr style={styles.hr} />
          <Text style={styles.small}>
            You get this message because you are a student in {data.courseCode}. Graded-attempt messages can be turned off under
            Settings; regrades by the staff are always sent.
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

// The password message: a one-time link to choose a password (reset, or a first password for an
// account made by the staff). It works once and expires after the minutes it carries (lib/mail/tokens.ts).
import { Body, Button, Container, Head, Heading, Html, Preview, Section, Text } from "@react-email/components";
import { styles } from "./styles";

export interface PasswordMailData {
  purpose: "reset" | "set";
  name: string;
  tokenPath: string;
  minutes: number;
}

function lifetime(minutes: number): string {
  if (minutes % (24 * 60) === 0) return `${minutes / (24 * 60)} days`;
  return `${minutes} minutes`;
}

export function passwordSubject(d: PasswordMailData): string {
  return d.purpose === "reset" ? "Choose a new Shuntwise password" : "Choose a password for your Shuntwise account";
}

export function PasswordMail({ data, url }: { data: PasswordMailData; url: string }) {
  const intro =
    data.purpose === "reset"
      ? "Someone, probably you, asked to reset the password of your Shuntwise account."
      : "An account on Shuntwise was made for you. Choose a password to sign in.";
  return (
    <Html lang="en">
      <Head />
      <Preview>{passwordSubject(data)}</Preview>
      <Body style={styles.body}>
        <Container style={styles.container}>
          <Heading as="h1" style={styles.h1}>
            {passwordSubject(data)}
          </Heading>
          <Text style={styles.text}>Hello {data.name},</Text>
          <Text style={styles.text}>{intro}</Text>
          <Section style={styles.actions}>
            <Button href={url} style={styles.button}>
              Choose a password
            </Button>
          </Section>
          <Text style={styles.small}>Or paste this address into your browser: {url}</Text>
          <Text style={styles.small}>
            The link works once and expires in {lifetime(data.minutes)}. Choosing a new password signs you out everywhere else. If you did
            not ask for this, ignore this message: your password stays as it is.
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

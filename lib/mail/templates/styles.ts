// Inline styles shared by the messages (mail clients ignore style sheets). Ink on paper, one accent.
import type { CSSProperties } from "react";

const font = "system-ui, -apple-system, 'Segoe UI', Roboto, sans-serif";

export const styles: Record<string, CSSProperties> = {
  body: { backgroundColor: "#f6f5f1", fontFamily: font, color: "#1d1f23", margin: 0, padding: "24px 0" },
  container: { backgroundColor: "#ffffff", maxWidth: "560px", margin: "0 auto", padding: "24px 28px", border: "1px solid #dddad2" },
  h1: { fontSize: "20px", lineHeight: "28px", margin: "4px 0 16px" },
  h2: { fontSize: "16px", lineHeight: "24px", margin: "20px 0 8px" },
  text: { fontSize: "15px", lineHeight: "22px", margin: "0 0 10px" },
  line: { fontSize: "14px", lineHeight: "20px", margin: "0 0 4px" },
  score: { fontSize: "17px", lineHeight: "24px", fontWeight: 600, margin: "0 0 12px" },
  box: { backgroundColor: "#f6f5f1", padding: "10px 14px", margin: "8px 0" },
  actions: { margin: "20px 0 12px" },
  button: { backgroundColor: "#1f5f8b", color: "#ffffff", padding: "10px 18px", borderRadius: "4px", fontSize: "15px", textDecoration: "none" },
  small: { fontSize: "12px", lineHeight: "18px", color: "#555a61", margin: "0 0 6px" },
  hr: { borderColor: "#dddad2", margin: "20px 0 12px" },
};

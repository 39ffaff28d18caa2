import type { MDXComponents } from "mdx/types";

// The prose styling of every lesson (headings, lists, tables, code) for @next/mdx. The widgets a lesson uses
// (calculators, diagrams, cautions) are not imported by the lessons: components/lesson/mdx.tsx passes them to
// each compiled lesson as its `components` prop.
const components: MDXComponents = {
  h2: (props) => <h2 className="mt-10 mb-3 text-2xl" {...props} />,
  h3: (props) => <h3 className="mt-6 mb-2 text-xl" {...props} />,
  p: (props) => <p className="my-3 leading-7" {...props} />,
  ul: (props) => <ul className="my-3 list-disc space-y-1 pl-6" {...props} />,
  ol: (props) => <ol className="my-3 list-decimal space-y-1 pl-6" {...props} />,
  table: (props) => (
    <div className="my-4 overflow-x-auto">
      <table className="min-w-full border-collapse text-sm [&_td]:border [&_td]:border-ink/15 [&_td]:px-2 [&_td]:py-1 [&_th]:border [&_th]:border-ink/15 [&_th]:bg-paper-sunk [&_th]:px-2 [&_th]:py-1" {...props} />
    </div>
  ),
  // Links in running text are underlined: colour alone does not tell them apart (WCAG 1.4.1).
  a: (props) => <a className="underline decoration-1 underline-offset-2" {...props} />,
  code: (props) => <code className="rounded bg-paper-sunk px-1 font-mono text-[0.9em]" {...props} />,
  blockquote: (props) => <blockquote className="my-4 border-l-4 border-copper-light pl-4 text-ink-soft" {...props} />,
};

export function useMDXComponents(): MDXComponents {
  return components;
}

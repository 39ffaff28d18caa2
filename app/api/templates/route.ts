import { json, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";
import { defaultVariantSpec, MISTAKES, TEMPLATE_KEYS, templates } from "@/lib/grader";

// The circuit templates a lab can be built from, with their parameters and quantities.
export const GET = route(async () => {
  await requireUser();
  return json({
    templates: TEMPLATE_KEYS.map((key) => {
      const t = templates[key];
      return {
        key,
        title: t.title,
        summary: t.summary,
        parameters: t.parameters,
        quantities: t.quantities,
        defaultSpec: defaultVariantSpec(key),
      };
    }),
    mistakes: MISTAKES,
  });
});

export { default } from "../../../courses/[courseId]/labs/new/forbidden";

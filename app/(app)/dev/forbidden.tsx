export { default } from "../admin/forbidden";

// The gradebook's pages refuse as the other course pages do.
export { default } from "../(app)/forbidden";

// E-mail: queue in the caller's transaction, deliver from a pg-boss worker, exactly once per event key.
export { queueMail, type MailRequest } from "./queue";
export { queueGradeMail, type GradeMailEvent, type GradeMailKind } from "./grade";

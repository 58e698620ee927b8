export * from "./capability";
export * from "./decision";
export * from "./descriptive";
export * from "./gamma";
export * from "./normal";
export * from "./tolerance";
export * from "./uncertainty";
export * from "./student-t";

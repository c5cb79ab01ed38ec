"use client";

export { GroupError as default } from "@/components/shell/group-error";

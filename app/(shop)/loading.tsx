export { GroupLoading as default } from "@/components/shell/group-loading";

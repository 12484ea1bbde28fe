// Kept at this path for the compound pages, which show a workup's status too.
export { StatusBadge } from "@/components/workup/detail/status-badge";

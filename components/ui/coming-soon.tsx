import { EmptyState, PageHeader } from "@/components/ui/page-header";

/** Stand-in for a section whose feature has not landed yet (its page is still guarded like every other). */
export function ComingSoon({ title, description }: { title: string; description: string }) {
  return (
    <>
      <PageHeader title={title} description={description} />
      <EmptyState title="This section is not built yet.">It will appear here once it is ready.</EmptyState>
    </>
  );
}

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="mx-auto max-w-md py-4 sm:py-8">
      <div className="rounded-card border border-line bg-paper-raised p-6 shadow-sm sm:p-8">{children}</div>
    </div>
  );
}

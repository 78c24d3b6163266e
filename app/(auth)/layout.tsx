export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-dvh flex-col items-center justify-center bg-brand px-4 py-10">
      <div className="w-full max-w-md rounded-2xl bg-paper-raised p-6 shadow-xl sm:p-8">
        <div className="mb-6 flex items-center gap-3">
          <img src="/icon.svg" alt="" width={40} height={40} />
          <div>
            <p className="text-2xl font-bold tracking-tight">Strutwise</p>
            <p className="text-sm text-ink-soft">Temporary works register and permits</p>
          </div>
        </div>
        {children}
      </div>
    </main>
  );
}

export default function CalendarLoading() {
  return (
    <div className="flex flex-col gap-6" aria-busy="true">
      <p className="sr-only" role="status">
        Loading the Boil calendar…
      </p>
      <div className="flex flex-col gap-2" aria-hidden="true">
        <div className="h-9 w-56 rounded-lg bg-birch-line motion-safe:animate-pulse" />
        <div className="h-5 w-full max-w-md rounded bg-birch-line motion-safe:animate-pulse" />
      </div>
      <div className="grid gap-3 sm:grid-cols-3" aria-hidden="true">
        {[0, 1, 2].map((i) => (
          <div key={i} className="h-20 rounded-xl border border-birch-line bg-birch-raised motion-safe:animate-pulse" />
        ))}
      </div>
      <div className="h-[560px] rounded-xl border border-birch-line bg-birch-raised motion-safe:animate-pulse" aria-hidden="true" />
    </div>
  );
}

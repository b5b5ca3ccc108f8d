/** A file path that may wrap after each slash, never in the middle of a name. */
export function FilePath({ path }: { path: string }) {
  const parts = path.split('/');
  return (
    <span className="[overflow-wrap:break-word]">
      {parts.map((part, i) => (
        <span key={i}>
          {part}
          {i < parts.length - 1 ? (
            <>
              /<wbr />
            </>
          ) : null}
        </span>
      ))}
    </span>
  );
}

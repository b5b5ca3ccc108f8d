import type { GradeScheme } from '@contracts/grades';
import { Table, tdClass, thClass } from '@/components/ui/table';

export function GradeSchemeTable({ scheme }: { scheme: GradeScheme }) {
  return (
    <Table caption="Grade scheme">
      <thead>
        <tr>
          <th className={`${thClass} w-16`}>Code</th>
          <th className={`${thClass} w-40`}>Label</th>
          <th className={thClass}>Meaning</th>
        </tr>
      </thead>
      <tbody>
        {scheme.map((g) => (
          <tr key={g.code}>
            <td className={`${tdClass} num`}>{g.code}</td>
            <td className={`${tdClass} font-medium`}>{g.label}</td>
            <td className={`${tdClass} text-ink-600`}>{g.meaning}</td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

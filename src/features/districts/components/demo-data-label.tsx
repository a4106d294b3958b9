import { useTranslation } from 'react-i18next';
import type { DistrictDto } from '../../../../shared/api/districts.schema';

/** A visible label on any screen that shows the invented demo districts. */
export function DemoDataLabel({ districts }: { districts: readonly Pick<DistrictDto, 'isDemo'>[] | undefined }) {
  const { t } = useTranslation('districts');
  if (!districts?.some((d) => d.isDemo)) return null;
  return <p className="demo-label">{t('demoLabel')}</p>;
}

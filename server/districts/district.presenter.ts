import type { DistrictDto } from '../../shared/api/districts.schema';
import type { DistrictWithPopulations } from './districts.repository';

export const presentDistrict = ({ district, populations, profileIds }: DistrictWithPopulations): DistrictDto => ({
  id: district.id,
  code: district.code,
  name: district.name,
  isDemo: district.isDemo,
  regionId: district.regionId ?? null,
  populations,
  profileIds,
  hasBoundary: district.boundary !== null,
  centroid: district.centroidLat === null || district.centroidLon === null
    ? null
    : { lat: district.centroidLat, lon: district.centroidLon },
});

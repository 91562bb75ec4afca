'use client';

import { useState } from 'react';
import type { SurveyStatus } from '@/lib/domain/vocabulary';
import { UploadDropZone } from './UploadDropZone';
import { UploadHistory } from './UploadHistory';

export function UploadsWorkbench({ siteId, surveys, defaultSurveyId, canUpload }: {
  siteId: number; surveys: { id: number; name: string; status: SurveyStatus }[]; defaultSurveyId: number | null; canUpload: boolean;
}) {
  const [refreshKey, setRefreshKey] = useState(0);
  return (
    <div className="space-y-5">
      {canUpload && <UploadDropZone siteId={siteId} surveys={surveys} defaultSurveyId={defaultSurveyId} onUploaded={() => setRefreshKey((k) => k + 1)} />}
      <UploadHistory siteId={siteId} refreshKey={refreshKey} />
    </div>
  );
}

"use client";

// Placeholder of the shared contract (the photos branch supplies the gallery and add-photo control).
export function RecordPhotos(props: { projectId: string; recordType: string; recordId: string; canAdd: boolean; title?: string }): null {
  void props;
  return null;
}

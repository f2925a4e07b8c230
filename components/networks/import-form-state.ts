import { useState } from 'react';
import type { Convention, ImportRequest } from '@/lib/schemas/network';

export type FormatChoice = 'auto' | 'csv' | 'tsv' | 'json' | 'graphml';

/** The import form's fields, and how they become the request the server validates. */
export function useImportFormState() {
  const [name, setName] = useState('');
  const [description, setDescription] = useState('');
  const [convention, setConvention] = useState<Convention>('in');
  const [source, setSource] = useState<'file' | 'paste'>('file');
  const [text, setText] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const [format, setFormat] = useState<FormatChoice>('auto');
  const [columns, setColumns] = useState({ source: '', target: '', weight: '' });
  const [weightKey, setWeightKey] = useState('');
  const [undirected, setUndirected] = useState<'refuse' | 'both-directions'>('refuse');
  const [duplicates, setDuplicates] = useState<'refuse' | 'sum'>('refuse');

  function toRequest(networkId?: number): ImportRequest {
    const cols = Object.fromEntries(Object.entries(columns).filter(([, v]) => v.trim() !== '').map(([k, v]) => [k, v.trim()]));
    return {
      ...(networkId ? { networkId } : { name: name.trim(), description: description.trim(), convention }),
      ...(format !== 'auto' ? { format } : {}),
      ...(source === 'paste' ? { text } : {}),
      options: {
        ...(Object.keys(cols).length ? { columns: cols } : {}),
        ...(weightKey.trim() ? { graphmlWeightKey: weightKey.trim() } : {}),
        undirected,
        duplicates,
      },
    };
  }

  return {
    name, setName, description, setDescription, convention, setConvention, source, setSource, text, setText,
    file, setFile, format, setFormat, columns, setColumns, weightKey, setWeightKey, undirected, setUndirected,
    duplicates, setDuplicates, toRequest,
  };
}

import { contextBridge, ipcRenderer } from 'electron';
import { channels, events } from '../contract';
import { buildBridge } from './bridge-api';

contextBridge.exposeInMainWorld('gazeloomBridge', buildBridge(ipcRenderer, Object.keys(channels), Object.keys(events)));

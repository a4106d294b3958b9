import { computeSeasonColumns, createSeasonColumns, compileProfile, profiles, degreeDaysFast, dayLengthFast, saturationVapourPressure } from './shared/model';
const D=365, R=5000; const tmin=new Float64Array(D), tmax=new Float64Array(D), rh=new Float64Array(D);
for(let i=0;i<D;i++){tmin[i]=10+10*Math.sin(i/58)+Math.random()*3; tmax[i]=tmin[i]+8+Math.random()*4; rh[i]=60;}
const out=createSeasonColumns(D);
for (const p of profiles){ const cp=compileProfile(p);
  for (const withRh of [true,false]) { const t=performance.now(); for(let r=0;r<R;r++) computeSeasonColumns(cp,{lat:30,biofix:'2023-03-01'},{startDate:'2023-01-01',tmin,tmax,rh: withRh?rh:null},out); console.log(p.id, withRh, ((performance.now()-t)/R/D*1e9/1000).toFixed(1),'ns/day'); }
}
let s=0; let t=performance.now(); for(let r=0;r<R;r++) for(let i=0;i<D;i++) s+=degreeDaysFast(2,0,11,32,tmin[i],tmax[i],NaN); console.log('dd', ((performance.now()-t)/R/D*1e6).toFixed(1),'ns');
t=performance.now(); for(let r=0;r<R;r++) for(let i=0;i<D;i++) s+=dayLengthFast(30,i+1,6,0.39795); console.log('dl', ((performance.now()-t)/R/D*1e6).toFixed(1),'ns');
t=performance.now(); for(let r=0;r<R;r++) for(let i=0;i<D;i++) s+=saturationVapourPressure(tmin[i]); console.log('es', ((performance.now()-t)/R/D*1e6).toFixed(1),'ns', s>0);
